'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field, Select, Textarea } from '@/components/ui/field';
import { ApiError } from '@/lib/api/client';
import { useUpdateRequest } from '@/lib/requests/hooks';
import { REQUEST_STATUSES, requestStatusLabels, type RequestStatus } from '@/lib/requests/schemas';
import { optionsOf, SelectOptions } from '@/components/forms/select-options';

export function RequestUpdate({ id, status, note }: { id: string; status: RequestStatus; note: string | null }) {
  const router = useRouter();
  const update = useUpdateRequest(id);
  const [next, setNext] = useState<RequestStatus>(status);
  const [officeNote, setOfficeNote] = useState(note ?? '');
  const [message, setMessage] = useState<{ tone: 'success' | 'danger'; text: string }>();
  return (
    <form
      className="grid max-w-xl gap-3"
      onSubmit={async (e) => {
        e.preventDefault();
        try {
          await update.mutateAsync({ status: next, officeNote });
          setMessage({ tone: 'success', text: 'Saved. The owner sees the new status.' });
          router.refresh();
        } catch (error) {
          setMessage({ tone: 'danger', text: error instanceof ApiError ? error.message : 'Could not save.' });
        }
      }}
    >
      {message ? <Alert tone={message.tone} title={message.text} /> : null}
      <Field id="req-status" label="Status">
        <Select id="req-status" value={next} onChange={(e) => setNext(e.target.value as RequestStatus)}>
          <SelectOptions options={optionsOf(REQUEST_STATUSES, requestStatusLabels)} />
        </Select>
      </Field>
      <Field id="req-note" label="Note to the owner">
        <Textarea id="req-note" value={officeNote} onChange={(e) => setOfficeNote(e.target.value)} />
      </Field>
      <div>
        <Button type="submit" disabled={update.isPending}>
          Save
        </Button>
      </div>
    </form>
  );
}
