'use client';

import { FileUp } from 'lucide-react';
import Link from 'next/link';
import { useId, useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button, ButtonLink } from '@/components/ui/button';
import { ApiError } from '@/lib/api/client';
import type { ImportPreview } from '@/lib/equipment/import';
import { useEquipmentImport } from '@/lib/equipment/hooks';
import { EQUIPMENT_TYPES, equipmentTypeLabels, type EquipmentType } from '@/lib/equipment/types';

const MAX_BYTES = 5_000_000;

export function ImportWizard({ siteId, siteName }: { siteId: string; siteName: string }) {
  const inputId = useId();
  const run = useEquipmentImport(siteId);
  const [file, setFile] = useState<{ name: string; text: string }>();
  const [preview, setPreview] = useState<ImportPreview>();
  const [imported, setImported] = useState<number>();
  const [error, setError] = useState<string>();

  async function check(name: string, text: string) {
    setError(undefined);
    setPreview(undefined);
    setImported(undefined);
    setFile({ name, text });
    try {
      setPreview(await run.mutateAsync({ csv: text, commit: false }));
    } catch (e) {
      setError(e instanceof ApiError ? e.message : 'The file could not be checked. Try again.');
    }
  }

  async function onFile(list: FileList | null) {
    const chosen = list?.[0];
    if (!chosen) return;
    if (chosen.size > MAX_BYTES) {
      setError('The file is larger than 5 MB. Split it into several files.');
      return;
    }
    // Read in the browser: the server receives text, never an upload it has to store.
    await check(chosen.name, await chosen.text());
  }

  async function commit() {
    if (!file) return;
    setError(undefined);
    try {
      const result = await run.mutateAsync({ csv: file.text, commit: true });
      if (result.imported > 0) setImported(result.imported);
      else setPreview(result);
    } catch (e) {
      setError(e instanceof ApiError ? e.message : 'Nothing was imported. Try again.');
    }
  }

  if (imported !== undefined) {
    return (
      <div className="space-y-4">
        <Alert tone="success" title={`Imported ${imported} ${imported === 1 ? 'item' : 'items'} into ${siteName}.`} />
        <ButtonLink href={`/sites/${siteId}`} size="lg">
          Back to {siteName}
        </ButtonLink>
      </div>
    );
  }

  const clean = preview !== undefined && preview.problems.length === 0 && preview.rowCount > 0;
  return (
    <div className="space-y-6">
      <div className="space-y-2">
        <label htmlFor={inputId} className="block text-sm font-semibold text-slate-800">
          CSV file
        </label>
        <input
          id={inputId}
          type="file"
          accept=".csv,text/csv"
          onChange={(e) => onFile(e.target.files)}
          className="block w-full max-w-xl rounded-md border border-slate-300 bg-white text-base file:mr-3 file:min-h-11 file:cursor-pointer file:border-0 file:bg-ice-900 file:px-4 file:font-semibold file:text-white"
        />
        {run.isPending && !preview ? <p className="text-sm text-slate-700">Checking {file?.name}…</p> : null}
      </div>

      {error ? <Alert tone="danger" title={error} /> : null}

      {preview ? (
        <div className="space-y-6" aria-live="polite">
          {preview.problems.length > 0 ? (
            <Alert tone="danger" title={`${preview.problems.length} ${preview.problems.length === 1 ? 'problem' : 'problems'} in ${file?.name}. Nothing was imported.`}>
              Fix them in the spreadsheet and choose the file again.
            </Alert>
          ) : preview.rowCount > 0 ? (
            <Alert tone="info" title={`${file?.name}: ${preview.rowCount} ${preview.rowCount === 1 ? 'row' : 'rows'}, no problems found.`}>
              Check the summary below, then import.
            </Alert>
          ) : null}

          {preview.problems.length > 0 ? <ProblemTable problems={preview.problems} /> : null}

          {preview.newAreas.length > 0 || preview.newSystems.length > 0 ? (
            <div className="grid gap-4 sm:grid-cols-2">
              <NameList title="New areas it would create" names={preview.newAreas} />
              <NameList title="New systems it would create" names={preview.newSystems} />
            </div>
          ) : null}

          {preview.sample.length > 0 ? <SampleTable sample={preview.sample} total={preview.rowCount} /> : null}

          <div className="flex flex-wrap gap-2">
            {clean ? (
              <Button size="lg" onClick={commit} disabled={run.isPending}>
                <FileUp aria-hidden className="size-5" />
                {run.isPending ? 'Importing…' : `Import ${preview.rowCount} ${preview.rowCount === 1 ? 'item' : 'items'}`}
              </Button>
            ) : null}
            <Link href={`/sites/${siteId}`} className="inline-flex min-h-12 items-center px-2 font-semibold text-ice-800 underline">
              Cancel and go back to the site
            </Link>
          </div>
        </div>
      ) : null}
    </div>
  );
}

function ProblemTable({ problems }: { problems: ImportPreview['problems'] }) {
  return (
    <div className="overflow-x-auto rounded-lg border border-red-300 bg-white">
      <table className="w-full text-left text-sm">
        <caption className="px-3 py-2 text-left font-semibold text-slate-900">Problems by line and column</caption>
        <thead className="bg-red-50 text-red-950">
          <tr>
            <th scope="col" className="px-3 py-2">
              Line
            </th>
            <th scope="col" className="px-3 py-2">
              Column
            </th>
            <th scope="col" className="px-3 py-2">
              Problem
            </th>
          </tr>
        </thead>
        <tbody className="divide-y divide-slate-200">
          {problems.map((p, i) => (
            <tr key={`${p.line}-${p.column}-${i}`}>
              <td className="px-3 py-2 font-mono">{p.line}</td>
              <td className="px-3 py-2 font-mono">{p.column || '—'}</td>
              <td className="px-3 py-2">{p.message}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function NameList({ title, names }: { title: string; names: string[] }) {
  return (
    <div className="rounded-lg border border-slate-200 bg-white p-4">
      <h3 className="font-semibold">{title}</h3>
      {names.length === 0 ? <p className="text-sm text-slate-600">None.</p> : null}
      <ul className="mt-1 list-disc pl-5 text-sm">
        {names.map((n) => (
          <li key={n}>{n}</li>
        ))}
      </ul>
    </div>
  );
}

function SampleTable({ sample, total }: { sample: ImportPreview['sample']; total: number }) {
  return (
    <div className="overflow-x-auto rounded-lg border border-slate-200 bg-white">
      <table className="w-full text-left text-sm">
        <caption className="px-3 py-2 text-left font-semibold text-slate-900">
          {sample.length < total ? `First ${sample.length} of ${total} rows` : `All ${total} rows`}
        </caption>
        <thead className="bg-slate-100">
          <tr>
            {['Line', 'Type', 'Name', 'Area', 'System', 'Serial'].map((h) => (
              <th key={h} scope="col" className="px-3 py-2">
                {h}
              </th>
            ))}
          </tr>
        </thead>
        <tbody className="divide-y divide-slate-200">
          {sample.map((r) => (
            <tr key={r.line}>
              <td className="px-3 py-2 font-mono">{r.line}</td>
              <td className="px-3 py-2">{(EQUIPMENT_TYPES as readonly string[]).includes(r.type) ? equipmentTypeLabels[r.type as EquipmentType] : r.type || '—'}</td>
              <td className="px-3 py-2">{r.name || '—'}</td>
              <td className="px-3 py-2">{r.area ?? '—'}</td>
              <td className="px-3 py-2">{r.system ?? '—'}</td>
              <td className="px-3 py-2 font-mono">{r.serial ?? '—'}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
