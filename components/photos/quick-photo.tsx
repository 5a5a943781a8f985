'use client';

import { Camera } from 'lucide-react';
import dynamic from 'next/dynamic';
import { useState } from 'react';
import { Button } from '@/components/ui/button';

// A photo from the unit's header in three taps: "Add photo", the kind, the shutter (the panel in
// quick-photo-panel.tsx). The panel, its uploads and the photo code load on the first press, not
// with the page a tag scan opens (DEVELOPERS.md, "Phone pages").
const QuickPhotoPanel = dynamic(() => import('@/components/photos/quick-photo-panel').then((m) => m.QuickPhotoPanel), {
  ssr: false,
  loading: () => <AddPhotoButton busy />,
});

function AddPhotoButton({ busy, onClick }: { busy?: boolean; onClick?: () => void }) {
  return (
    <div className="flex min-w-0 flex-col gap-2">
      <Button size="lg" variant="secondary" onClick={onClick} aria-haspopup="dialog" aria-busy={busy || undefined}>
        <Camera aria-hidden className="size-5" />
        Add photo
      </Button>
    </div>
  );
}

export function QuickPhotoButton({ equipmentId, canUpload }: { equipmentId: string; canUpload: boolean }) {
  const [started, setStarted] = useState(false);
  if (!canUpload) return null;
  return started ? <QuickPhotoPanel equipmentId={equipmentId} /> : <AddPhotoButton onClick={() => setStarted(true)} />;
}
