import { useNavigate } from 'react-router';
import { ContentLayout } from '../../../components/layouts/content-layout';
import { useCreateBatch } from '../../../features/batches/api/create-batch';
import { BatchForm } from '../../../features/batches/components/batch-form';

export default function NewBatchRoute() {
  const create = useCreateBatch();
  const navigate = useNavigate();
  return (
    <ContentLayout title="Add a batch" lead="Only the stage, a label and the day you made it are needed; the weights give you the sugar check.">
      <BatchForm
        submitLabel="Put it on the shelf"
        pendingLabel="Saving…"
        isPending={create.isPending}
        onSave={async (body) => {
          const batch = await create.mutateAsync(body);
          await navigate(`/batches/${batch.id}`);
        }}
      />
    </ContentLayout>
  );
}
