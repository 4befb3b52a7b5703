import { createPortal } from 'react-dom';
import { SUGAR_TYPES } from '@shared/batch-check-model';
import { massToGrams } from '@shared/units';
import { SporewellMark } from '../../../components/layouts/sporewell-mark';
import { cx } from '../../../components/ui/cx';
import type { BatchView } from '@shared/case-schemas';
import { formatMadeOn, stageLabel } from '../lib/batch-format';
import { ratioText } from '../../batch-check/components/ratio-text';
import { BatchQrCode } from './batch-qr-code';

/** The printed size: a common rectangular jar label. */
export const LABEL_SIZE_MM = { width: 90, height: 55 } as const;

export function batchUrl(id: number): string {
  return `${window.location.origin}/batches/${id}`;
}

function ratioLine(batch: BatchView): string {
  if (!batch.culture || batch.culture.value <= 0) return 'Weights not recorded';
  if (!batch.sugar || batch.sugar.value === 0) return 'No sugar';
  return ratioText(massToGrams(batch.sugar) / massToGrams(batch.culture));
}

/**
 * The label itself, in millimetres so the screen preview and the paper match. Black on white
 * for contrast on paper and under a phone camera.
 */
export function JarLabel({ batch, className, asPrint = false }: { batch: BatchView; className?: string; asPrint?: boolean }) {
  const sugar = batch.sugarType ? SUGAR_TYPES[batch.sugarType].label : null;
  return (
    <div
      // The print copy repeats the preview; only one of them is ever visible.
      aria-hidden={asPrint || undefined}
      className={cx('flex overflow-hidden bg-white text-black', className)}
      style={{ width: `${LABEL_SIZE_MM.width}mm`, height: `${LABEL_SIZE_MM.height}mm`, padding: '3.5mm', gap: '3mm' }}
    >
      <div className="flex min-w-0 flex-1 flex-col" style={{ gap: '1mm' }}>
        <p className="flex items-center font-extrabold" style={{ fontSize: '7pt', gap: '1.2mm', lineHeight: 1.1 }}>
          <SporewellMark className="size-[4mm] shrink-0" />
          Sporewell
        </p>
        <p className="font-extrabold break-words" style={{ fontSize: '13pt', lineHeight: 1.1 }}>
          {batch.label}
        </p>
        <p className="font-bold" style={{ fontSize: '8.5pt', lineHeight: 1.2 }}>
          {stageLabel(batch.stage)}
        </p>
        <dl className="mt-auto" style={{ fontSize: '8pt', lineHeight: 1.3 }}>
          <div className="flex" style={{ gap: '1.5mm' }}>
            <dt>Made</dt>
            <dd className="font-bold">{formatMadeOn(batch.madeOn)}</dd>
          </div>
          <div className="flex" style={{ gap: '1.5mm' }}>
            <dt>Ratio</dt>
            <dd className="font-bold">{ratioLine(batch)}</dd>
          </div>
          {sugar && batch.sugar && batch.sugar.value > 0 && (
            <div className="flex" style={{ gap: '1.5mm' }}>
              <dt>Sugar</dt>
              <dd className="font-bold">{sugar}</dd>
            </div>
          )}
        </dl>
      </div>
      <div className="flex shrink-0 flex-col items-center justify-center" style={{ width: '30mm', gap: '1mm' }}>
        <BatchQrCode url={batchUrl(batch.id)} title={`QR code linking to this batch's page on Sporewell`} className="block w-full" />
        <p className="text-center" style={{ fontSize: '6pt', lineHeight: 1.1 }}>
          Scan for this batch
        </p>
      </div>
    </div>
  );
}

/**
 * Prints the label alone: while this is mounted, printing hides the app and shows a copy of
 * the label placed straight in <body>, on a page the size of the label.
 */
export function JarLabelPrintCopy({ batch }: { batch: BatchView }) {
  const css = `
@page { size: ${LABEL_SIZE_MM.width}mm ${LABEL_SIZE_MM.height}mm; margin: 0; }
@media print {
  html, body { margin: 0 !important; padding: 0 !important; background: #ffffff !important; }
  #root { display: none !important; }
  .jar-label-print { display: block !important; }
}
@media screen { .jar-label-print { display: none !important; } }`;
  return createPortal(
    <div className="jar-label-print">
      <style>{css}</style>
      <JarLabel batch={batch} asPrint />
    </div>,
    document.body,
  );
}
