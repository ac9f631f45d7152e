import type { ShelfUnit } from '../../shelf/types';
import { printedCode, unitAddress } from '../unit-address';
import { QrCode } from './qr-code';

/** What a mark says in words alone, so a label printed in black and white still tells units apart. */
function markInWords(unit: ShelfUnit): string {
  if (unit.mark && unit.mark_colour && !unit.mark.toLowerCase().includes(unit.mark_colour))
    return `${unit.mark} (${unit.mark_colour})`;
  return unit.mark ?? (unit.mark_colour ? `${unit.mark_colour} mark` : 'No mark');
}

/** One sticky label: the unit's QR code beside its label, mark, outputs and short code, sized by the sheet. */
export function UnitLabel({ unit, origin }: { unit: ShelfUnit; origin: string }) {
  return (
    <div className="unit-label" data-unit={unit.id}>
      <QrCode
        text={unitAddress(origin, unit.workspace_id, unit.id)}
        title={`QR code of ${unit.label}'s page`}
        className="unit-label-qr"
      />
      <div className="unit-label-text">
        <p className="unit-label-name">{unit.label}</p>
        <p>{markInWords(unit)}</p>
        <p>
          {unit.outputs} {unit.outputs === 1 ? 'output' : 'outputs'}
        </p>
        <p className="unit-label-code" aria-label={`Short code ${unit.short_code}`}>
          {printedCode(unit.short_code)}
        </p>
      </div>
    </div>
  );
}
