import { describe, expect, it } from 'vitest';
import { contentDisposition, downloadResponse } from '@/lib/api/download';

describe('file downloads', () => {
  it('names the file in both header forms (RFC 6266, RFC 5987)', () => {
    expect(contentDisposition('attachment', 'équipement "B".csv')).toBe(
      `attachment; filename="_quipement _B_.csv"; filename*=UTF-8''%C3%A9quipement%20%22B%22.csv`,
    );
    expect(contentDisposition('inline', 'visit-report-1a2b3c4d.pdf')).toBe(
      `inline; filename="visit-report-1a2b3c4d.pdf"; filename*=UTF-8''visit-report-1a2b3c4d.pdf`,
    );
  });

  it('sends the bytes with the type, no caching by default, and the caller\'s cache rule when given', async () => {
    const pdf = downloadResponse({ filename: 'r.pdf', contentType: 'application/pdf', body: new Uint8Array([37, 80, 68, 70]) }, { disposition: 'inline' });
    expect(pdf.headers.get('content-type')).toBe('application/pdf');
    expect(pdf.headers.get('content-disposition')).toMatch(/^inline; filename="r.pdf"/);
    expect(pdf.headers.get('cache-control')).toBe('private, no-store');
    expect(new Uint8Array(await pdf.arrayBuffer())).toEqual(new Uint8Array([37, 80, 68, 70]));
    const csv = downloadResponse({ filename: 'e.csv', contentType: 'text/csv; charset=utf-8', body: 'a,b\r\n' }, { cacheControl: 'no-cache' });
    expect(csv.headers.get('content-disposition')).toMatch(/^attachment; /);
    expect(csv.headers.get('cache-control')).toBe('no-cache');
    expect(await csv.text()).toBe('a,b\r\n');
  });
});
