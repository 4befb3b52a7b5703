import { useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { casesKeys } from '../api/cases-keys';
import { usePhotoDrafts } from '../hooks/use-photo-drafts';
import { PhotoPicker } from './photo-picker';

/**
 * Add photos to a case that is already open: choose, check the previews, send. The grower adds
 * more of their batch; a mentor may show the grower something (a healthy culture, a cover).
 */
export function AddCasePhotos({ caseId, by }: { caseId: number; by: 'grower' | 'mentor' }) {
  const photos = usePhotoDrafts();
  const queryClient = useQueryClient();
  const [result, setResult] = useState<{ sent: number; failed: number } | null>(null);
  const busy = photos.uploading;

  const send = async () => {
    setResult(null);
    const outcome = await photos.uploadAll(caseId);
    await queryClient.invalidateQueries({ queryKey: casesKeys.detail(caseId) });
    photos.clearSent();
    setResult(outcome);
  };

  return (
    <div className="flex flex-col gap-3">
      <PhotoPicker
        photos={photos}
        label={by === 'grower' ? 'More photos of the batch' : 'Photos to show the grower'}
        hint={
          by === 'grower'
            ? 'Up to 6 at a time. They are made lighter before sending; only the grower of the case and the mentors can see them.'
            : 'For example, a healthy culture at this stage, or a cover that breathes. Up to 6 at a time; only the grower of the case and the mentors can see them.'
        }
        disabled={busy}
      />
      {photos.pending > 0 && (
        <Button onClick={() => void send()} disabled={busy} className="self-start">
          {busy ? 'Sending…' : photos.pending === 1 ? 'Send this photo' : `Send these ${photos.pending} photos`}
        </Button>
      )}
      {result && result.sent > 0 && result.failed === 0 && (
        <Alert tone="success">{result.sent === 1 ? 'The photo was added to the case.' : `${result.sent} photos were added to the case.`}</Alert>
      )}
      {result && result.failed > 0 && (
        <Alert tone="warning" title={result.failed === 1 ? 'One photo was not sent' : `${result.failed} photos were not sent`}>
          The reason is beside each photo; you can try again.
        </Alert>
      )}
    </div>
  );
}
