import { describe, expect, it } from 'vitest';
import { unsentCount, unsentMessage, type UploadItem } from '@/components/photos/use-photo-uploads';
import { inAppPath } from '@/lib/ui/in-app-path';

const here = 'http://localhost:3100/equipment/7f1c0c8e-0000-4000-8000-000000000001?tab=photos';

describe('inAppPath: which links a leave guard asks about', () => {
  it('asks about another page of the app, relative or absolute', () => {
    expect(inAppPath('/sites/abc', '', here)).toBe('/sites/abc');
    expect(inAppPath('http://localhost:3100/visits?mine=1#top', '_self', here)).toBe('/visits?mine=1#top');
    // The same page with another query is another screen.
    expect(inAppPath('/equipment/7f1c0c8e-0000-4000-8000-000000000001', '', here)).toBe('/equipment/7f1c0c8e-0000-4000-8000-000000000001');
  });

  it('lets a jump within the page, a new tab and another site go without asking', () => {
    expect(inAppPath('#photos-h', '', here)).toBeNull();
    expect(inAppPath('/sites/abc', '_blank', here)).toBeNull();
    expect(inAppPath('http://localhost:3000/sites/abc', '', here)).toBeNull();
    expect(inAppPath('https://example.org/help', '', here)).toBeNull();
    expect(inAppPath('http://[bad', '', here)).toBeNull();
  });
});

describe('photos not yet sent', () => {
  const item = (status: UploadItem['status'], retryable = true) => ({ status, retryable }) as UploadItem;

  it('counts waiting, travelling and retryable failed photos, not stored or refused ones', () => {
    expect(unsentCount([item('queued'), item('uploading'), item('processing'), item('failed'), item('failed', false), item('done')])).toBe(4);
    expect(unsentCount([item('done'), item('failed', false)])).toBe(0);
  });

  it('says how many in words', () => {
    expect(unsentMessage(1)).toBe('1 photo is not sent yet.');
    expect(unsentMessage(3)).toBe('3 photos are not sent yet.');
  });
});
