import type { ReactNode } from 'react';
import { TextLink } from '@/components/ui/text-link';

/**
 * A page header's subtitle for work at one site: the site's name, linked to its page, and its
 * client (left out for an owner, who knows it); `lead` goes before the name, `children` after.
 */
export function SiteLine({
  site,
  lead,
  showClient = true,
  children,
}: {
  site: { id: string; name: string; clientName: string };
  lead?: string;
  showClient?: boolean;
  children?: ReactNode;
}) {
  return (
    <>
      {lead ? `${lead} ` : null}
      <TextLink href={`/sites/${site.id}`}>{site.name}</TextLink>
      {showClient ? ` · ${site.clientName}` : null}
      {children}
    </>
  );
}
