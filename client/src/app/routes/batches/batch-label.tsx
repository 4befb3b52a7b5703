import { Link } from 'react-router';
import { ContentLayout } from '../../../components/layouts/content-layout';
import { Button } from '../../../components/ui/button';
import { batchRouteLoader, useRouteBatch } from '../../../features/batches/api/get-batch';
import { JarLabel, JarLabelPrintCopy, LABEL_SIZE_MM } from '../../../features/batches/components/jar-label';

export const clientLoader = batchRouteLoader;

export default function BatchLabelRoute() {
  const batch = useRouteBatch();

  return (
    <ContentLayout
      title={`Jar label: ${batch.label}`}
      lead={`Printed on its own at ${LABEL_SIZE_MM.width} × ${LABEL_SIZE_MM.height} mm. Scanning the code opens this batch on Sporewell (you need to be signed in).`}
    >
      <div className="flex flex-col items-start gap-6">
        <div className="max-w-full overflow-x-auto rounded-soft border-2 border-dashed border-loam-soft p-2">
          <JarLabel batch={batch} />
        </div>
        <div className="flex flex-wrap gap-3">
          <Button onClick={() => window.print()}>Print the label</Button>
          <Link to={`/batches/${batch.id}`} className="inline-flex min-h-11 items-center font-bold">
            Back to the batch
          </Link>
        </div>
        <p className="max-w-prose text-loam-soft">
          In the print window, choose “Actual size” (100 %) so the label comes out at its real size. On sticker sheets, print a test on plain
          paper first.
        </p>
      </div>
      <JarLabelPrintCopy batch={batch} />
    </ContentLayout>
  );
}
