import type { Metadata } from 'next';
import Link from 'next/link';
import { Alert } from '@/components/ui/alert';
import { Card, PageHeader } from '@/components/ui/card';
import { orNotFound } from '@/lib/api/page';
import { requirePageActor } from '@/lib/auth';
import { photoUrls } from '@/lib/photos/dto';
import { getRequest } from '@/lib/requests/service';
import { urgencyLabels } from '@/lib/requests/schemas';
import { RequestStatusBadge, UrgencyBadge } from '@/app/(app)/requests/_components/badges';
import { RequestUpdate } from '@/app/(app)/requests/_components/request-update';

export const metadata: Metadata = { title: 'Service request' };

export default async function RequestPage({ params, searchParams }: { params: Promise<{ id: string }>; searchParams: Promise<{ sent?: string }> }) {
  const { id } = await params;
  const actor = await requirePageActor(`/requests/${id}`, 'requests.read');
  const request = await orNotFound(getRequest(actor, id));
  const { sent } = await searchParams;
  return (
    <div className="space-y-4">
      <PageHeader title="Service request" subtitle={`${request.siteName} · ${request.clientName}`} />
      {sent ? <Alert tone="success" title="Request sent. The office has been e-mailed." /> : null}
      <Card className="space-y-2">
        <div className="flex flex-wrap gap-2">
          <UrgencyBadge urgency={request.urgency} title={urgencyLabels[request.urgency]} />
          <RequestStatusBadge status={request.status} />
        </div>
        <p className="whitespace-pre-line text-base">{request.description}</p>
        <p className="text-sm text-slate-600">
          From {request.requestedByName}, {request.createdAt.slice(0, 16).replace('T', ' ')} UTC ·{' '}
          <Link className="underline" href={`/sites/${request.siteId}`}>
            {request.siteName}
          </Link>
          {request.equipmentId ? (
            <>
              {' · '}
              <Link className="underline" href={`/equipment/${request.equipmentId}`}>
                {request.equipmentName}
              </Link>
            </>
          ) : null}
        </p>
        {request.photoId ? <RequestPhoto photoId={request.photoId} /> : null}
        {request.officeNote ? (
          <p className="rounded-md bg-ice-50 p-2 text-sm">
            <strong>Office:</strong> {request.officeNote}
          </p>
        ) : null}
        {request.visitId ? (
          <p className="text-sm">
            <Link className="underline" href={`/visits/${request.visitId}`}>
              The visit for this request
            </Link>
          </p>
        ) : null}
      </Card>
      {request.canManage ? (
        <section aria-labelledby="update-h">
          <h2 id="update-h" className="mb-2 text-lg font-semibold">
            Update
          </h2>
          <RequestUpdate id={request.id} status={request.status} note={request.officeNote} />
        </section>
      ) : null}
    </div>
  );
}

/** The photo sent with the request; it also sits in the unit's photos. */
function RequestPhoto({ photoId }: { photoId: string }) {
  const urls = photoUrls(photoId);
  return (
    <figure className="space-y-1">
      <a href={urls.display} className="inline-block rounded-md focus-visible:outline-3 focus-visible:outline-offset-2" target="_blank" rel="noopener">
        {/* eslint-disable-next-line @next/next/no-img-element -- served by the access-checked photo route */}
        <img src={urls.thumb} alt="Photo sent with the request" width={160} height={160} className="size-40 rounded-md border border-slate-300 object-cover" />
      </a>
      <figcaption className="text-sm text-slate-600">Photo sent with the request (opens full size)</figcaption>
    </figure>
  );
}
