import QRCode from 'qrcode';
import { useMemo } from 'react';

/**
 * A QR code drawn as one SVG path, dark modules on white with the four-module quiet
 * zone scanners need; `qrcode` does the encoding. Medium error correction leaves room
 * for a scuffed label.
 */
export function QrCode({ text, title, className }: { text: string; title: string; className?: string }) {
  const { size, path } = useMemo(() => {
    const { modules } = QRCode.create(text, { errorCorrectionLevel: 'M' });
    const quiet = 4;
    let d = '';
    for (let row = 0; row < modules.size; row += 1) {
      for (let column = 0; column < modules.size; column += 1) {
        if (modules.get(row, column)) d += `M${column + quiet} ${row + quiet}h1v1h-1z`;
      }
    }
    return { size: modules.size + 2 * quiet, path: d };
  }, [text]);
  return (
    <svg
      viewBox={`0 0 ${size} ${size}`}
      role="img"
      aria-label={title}
      shapeRendering="crispEdges"
      className={className}
    >
      <rect width={size} height={size} fill="#ffffff" />
      <path d={path} fill="#000000" />
    </svg>
  );
}
