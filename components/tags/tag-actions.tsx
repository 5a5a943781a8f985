'use client';

import { Ban, Replace } from 'lucide-react';
import dynamic from 'next/dynamic';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Select } from '@/components/ui/field';
import { ApiError } from '@/lib/api/client';
import { equipmentKeys } from '@/lib/equipment/keys';
import { invalidateQueries } from '@/lib/query/invalidate';
import { formatCode } from '@/lib/tags/code';
import { tagKeys } from '@/lib/tags/keys';
import { attachTag, retireTag } from '@/lib/tags/requests';
import type { AttachTagInput, RetireTagInput } from '@/lib/tags/schemas';

// Typing a new code is the rarer path: its field loads when "Attach" or "Replace" is chosen.
const CodeEntry = dynamic(() => import('@/components/tags/code-entry').then((m) => m.CodeEntry), { ssr: false });

/**
 * "Replace tag" (or "Attach a tag"): type the code of a blank tag to put on this unit; the old tag is
 * retired as replaced and its scans still lead here. "Retire tag" for a damaged or lost tag with no
 * replacement at hand.
 */
export function TagActions({ equipmentId, currentCode }: { equipmentId: string; currentCode: string | null }) {
  const router = useRouter();
  // Plain requests, not useMutation: a unit's page ships without the query library (DEVELOPERS.md, "Phone pages").
  const [pending, setPending] = useState<'attach' | 'retire' | null>(null);
  const [mode, setMode] = useState<'idle' | 'replace' | 'retire'>('idle');
  const [reason, setReason] = useState<'damaged' | 'lost'>('damaged');
  const [error, setError] = useState<string>();
  const [done, setDone] = useState<string>();

  async function attachCode(code: string) {
    setError(undefined);
    setPending('attach');
    try {
      const input: AttachTagInput = { equipmentId };
      const result = await attachTag(code, input);
      void invalidateQueries(tagKeys.all, equipmentKeys.all);
      setDone(result.replaced ? `Tag ${formatCode(code)} attached; ${formatCode(result.replaced.code)} is retired.` : `Tag ${formatCode(code)} attached.`);
      setMode('idle');
      router.refresh();
    } catch (e) {
      setError(e instanceof ApiError ? (e.status === 404 ? 'No blank tag of your company has this code.' : e.message) : 'Something went wrong. Nothing was changed.');
    } finally {
      setPending(null);
    }
  }

  async function retireCurrent() {
    if (!currentCode) return;
    setError(undefined);
    setPending('retire');
    try {
      const input: RetireTagInput = { reason };
      await retireTag(currentCode, input);
      void invalidateQueries(tagKeys.all);
      setDone(`Tag ${formatCode(currentCode)} retired.`);
      setMode('idle');
      router.refresh();
    } catch (e) {
      setError(e instanceof ApiError ? e.message : 'Something went wrong. Nothing was changed.');
    } finally {
      setPending(null);
    }
  }

  return (
    <div className="space-y-3">
      {done ? <Alert tone="success" title={done} /> : null}
      {error ? <Alert tone="danger" title={error} /> : null}
      {mode === 'idle' ? (
        <div className="flex flex-wrap gap-2">
          <Button variant="secondary" size="lg" onClick={() => setMode('replace')}>
            <Replace aria-hidden className="size-5" /> {currentCode ? 'Replace tag' : 'Attach a tag'}
          </Button>
          {currentCode ? (
            <Button variant="ghost" size="lg" onClick={() => setMode('retire')}>
              <Ban aria-hidden className="size-5" /> Retire tag
            </Button>
          ) : null}
        </div>
      ) : mode === 'replace' ? (
        <div className="space-y-2 rounded-md border border-slate-200 p-3">
          <p className="text-sm text-slate-700">
            Put a blank tag on the unit, then type its code.{currentCode ? ' The current tag is retired; scanning it will still open this unit.' : ''}
          </p>
          <CodeEntry label="New tag code" submitLabel={currentCode ? 'Replace' : 'Attach'} busy={pending === 'attach'} onSubmit={(code) => void attachCode(code)} autoFocus />
          <Button variant="ghost" onClick={() => setMode('idle')}>
            Cancel
          </Button>
        </div>
      ) : (
        <div className="space-y-2 rounded-md border border-slate-200 p-3">
          <label htmlFor="retire-reason" className="block text-sm font-semibold">
            Why is tag {currentCode ? formatCode(currentCode) : ''} retired?
          </label>
          <Select id="retire-reason" value={reason} onChange={(e) => setReason(e.target.value as 'damaged' | 'lost')} className="max-w-sm">
            <option value="damaged">Damaged or unreadable</option>
            <option value="lost">Lost or removed from the unit</option>
          </Select>
          <div className="flex flex-wrap gap-2">
            <Button variant="danger" size="lg" disabled={pending === 'retire'} onClick={() => void retireCurrent()}>
              {pending === 'retire' ? 'Retiring…' : 'Retire tag'}
            </Button>
            <Button variant="ghost" size="lg" onClick={() => setMode('idle')}>
              Cancel
            </Button>
          </div>
        </div>
      )}
    </div>
  );
}
