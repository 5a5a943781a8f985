'use client';

import { CheckCircle2, CircleAlert, Keyboard } from 'lucide-react';
import { useId, useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { CODE_LENGTH, checkCode, formatCode, type CodeCheck } from '@/lib/tags/code';
import { cn } from '@/lib/utils';

function message(check: CodeCheck): { tone: 'hint' | 'error' | 'ok'; text: string } {
  switch (check.status) {
    case 'empty':
      return { tone: 'hint', text: `The ${CODE_LENGTH} letters and digits under the QR symbol, e.g. K7Q-M3X-9PA. Dashes are optional.` };
    case 'incomplete':
      return { tone: 'hint', text: `${check.missing} more ${check.missing === 1 ? 'character' : 'characters'} to go.` };
    case 'bad_character':
      return { tone: 'error', text: `“${check.character}” (character ${check.position}) is not used in tag codes.` };
    case 'too_long':
      return { tone: 'error', text: `Too long: a tag code has ${CODE_LENGTH} characters.` };
    case 'check_failed':
      return { tone: 'error', text: 'This code does not add up: a character is wrong or two are swapped. Check it against the label.' };
    case 'valid':
      return { tone: 'ok', text: 'Code checks out.' };
  }
}

/**
 * Typing a tag code: the check character is verified on every keystroke, so a typo is caught before
 * anything is looked up. Large text and targets for gloved hands.
 */
export function CodeEntry({
  label = 'Tag code',
  submitLabel = 'Open',
  busy = false,
  onSubmit,
  autoFocus = false,
}: {
  label?: string;
  submitLabel?: string;
  busy?: boolean;
  onSubmit: (code: string) => void;
  autoFocus?: boolean;
}) {
  const id = useId();
  const [value, setValue] = useState('');
  const check = checkCode(value);
  const note = message(check);
  const valid = check.status === 'valid';

  function submit(e: FormEvent) {
    e.preventDefault();
    if (valid) onSubmit(check.normalized);
  }

  return (
    <form onSubmit={submit} noValidate className="space-y-2">
      <label htmlFor={id} className="flex items-center gap-2 text-base font-semibold text-slate-800">
        <Keyboard aria-hidden className="size-5" />
        {label}
      </label>
      <div className="flex flex-col gap-2 sm:flex-row">
        <input
          id={id}
          name="code"
          value={value}
          onChange={(e) => setValue(formatCode(e.target.value).slice(0, 15))}
          autoComplete="off"
          autoCapitalize="characters"
          autoCorrect="off"
          spellCheck={false}
          inputMode="text"
          autoFocus={autoFocus}
          placeholder="K7Q-M3X-9PA"
          aria-invalid={note.tone === 'error'}
          aria-describedby={`${id}-note`}
          className="block min-h-14 w-full rounded-md border-2 border-slate-400 bg-white px-3 font-mono text-2xl uppercase tracking-widest text-slate-900 placeholder:text-slate-400 aria-[invalid=true]:border-red-700 sm:max-w-xs"
        />
        <Button type="submit" size="lg" disabled={!valid || busy} className="min-h-14 text-lg sm:w-40">
          {busy ? 'Opening…' : submitLabel}
        </Button>
      </div>
      <p
        id={`${id}-note`}
        aria-live="polite"
        data-code-status={check.status}
        className={cn(
          'flex items-start gap-1.5 text-sm',
          note.tone === 'error' ? 'font-medium text-red-800' : note.tone === 'ok' ? 'font-medium text-emerald-800' : 'text-slate-600',
        )}
      >
        {note.tone === 'error' ? <CircleAlert aria-hidden className="mt-0.5 size-4 shrink-0" /> : null}
        {note.tone === 'ok' ? <CheckCircle2 aria-hidden className="mt-0.5 size-4 shrink-0" /> : null}
        {note.text}
      </p>
    </form>
  );
}
