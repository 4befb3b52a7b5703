import { useNavigate } from 'react-router';
import { ContentLayout } from '../../../components/layouts/content-layout';
import { batchRouteLoader, useRouteBatch } from '../../../features/batches/api/get-batch';
import { useUpdateBatch } from '../../../features/batches/api/update-batch';
import { BatchForm } from '../../../features/batches/components/batch-form';

export const clientLoader = batchRouteLoader;

export default function EditBatchRoute() {
  const batch = useRouteBatch();
  const update = useUpdateBatch(batch.id);
  const navigate = useNavigate();
  return (
    <ContentLayout title={`Edit ${batch.label}`}>
      <BatchForm
        batch={batch}
        submitLabel="Save changes"
        pendingLabel="Saving…"
        isPending={update.isPending}
        onSave={async (body) => {
          await update.mutateAsync(body);
          await navigate(`/batches/${batch.id}`);
        }}
      />
    </ContentLayout>
  );
}
