'use client';

import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';

export default function AppError({ reset }: { error: Error; reset: () => void }) {
  return (
    <div className="max-w-xl space-y-4">
      <Alert tone="danger" title="This page could not be loaded.">
        Nothing was changed. Check the connection and try again.
      </Alert>
      <Button onClick={reset}>Try again</Button>
    </div>
  );
}
