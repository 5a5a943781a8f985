import { permissions, roleLabels, roles, type Permission } from '@/lib/auth/permissions';

// The access matrix as a Markdown table for DEVELOPERS.md; a unit test keeps the two identical.
export function renderAccessMatrix(): string {
  const header = `| permission | ${roles.map((r) => roleLabels[r]).join(' | ')} |`;
  const rule = `|---|${roles.map(() => ':-:').join('|')}|`;
  const rows = (Object.keys(permissions) as Permission[]).map(
    (p) => `| \`${p}\` | ${roles.map((r) => ((permissions[p] as readonly string[]).includes(r) ? 'yes' : '—')).join(' | ')} |`,
  );
  return [header, rule, ...rows].join('\n');
}
