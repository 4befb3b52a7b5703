import { useMemo } from 'react';
import QRCode from 'qrcode';

/** A QR code drawn as one SVG path: sharp at any print size, no canvas, no image to load. */
export function BatchQrCode({ url, title, className }: { url: string; title: string; className?: string }) {
  const { size, path } = useMemo(() => {
    // Level M survives a smudge or a drop of juice on the jar.
    const { modules } = QRCode.create(url, { errorCorrectionLevel: 'M' });
    let d = '';
    for (let row = 0; row < modules.size; row++) {
      for (let col = 0; col < modules.size; col++) {
        if (modules.get(row, col)) d += `M${col + 4} ${row + 4}h1v1h-1z`;
      }
    }
    // Four modules of quiet zone on each side, as scanners expect.
    return { size: modules.size + 8, path: d };
  }, [url]);

  return (
    <svg role="img" aria-label={title} viewBox={`0 0 ${size} ${size}`} shapeRendering="crispEdges" className={className}>
      <rect width={size} height={size} fill="#ffffff" />
      <path d={path} fill="#000000" />
    </svg>
  );
}
