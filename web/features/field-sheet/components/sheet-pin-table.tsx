import { describeFailsafe } from '@shared/reuse/stored-settings';
import { SinceNote } from '../../provenance/components/since-note';
import type { Provenance } from '../../provenance/since';
import type { SheetReceiver } from '../types';

export function SheetPinTable({ receiver, provenance }: { receiver: SheetReceiver; provenance?: Provenance }) {
  return (
    <table className="w-full text-left text-sm">
      <caption className="sr-only">
        Pins of {receiver.label ?? receiver.id}: channel, function, failsafe and what it does when the link is lost
      </caption>
      <thead className="border-b border-ply-300 text-xs text-ink-700">
        <tr>
          <th scope="col" className="py-1 pr-2 font-medium">
            Pin
          </th>
          <th scope="col" className="py-1 pr-2 font-medium">
            Ch
          </th>
          <th scope="col" className="py-1 pr-2 font-medium">
            Function
          </th>
          <th scope="col" className="py-1 pr-2 font-medium">
            Failsafe
          </th>
          <th scope="col" className="py-1 font-medium">
            Link lost
          </th>
        </tr>
      </thead>
      <tbody className="divide-y divide-ply-200">
        {receiver.pins.length === 0 ? (
          <tr>
            <td colSpan={5} className="py-1 text-ink-700">
              No pins mapped
            </td>
          </tr>
        ) : (
          receiver.pins.map((pin) => (
            <tr key={pin.pin}>
              <td className="py-1 pr-2 font-mono">
                <SinceNote provenance={provenance} path={`receivers[id=${receiver.id}].map[pin=${pin.pin}]`}>
                  {pin.pin}
                </SinceNote>
              </td>
              <td className="py-1 pr-2 font-mono">{pin.ch}</td>
              <td className="py-1 pr-2">{pin.function ?? <span className="text-ink-500">no plan entry</span>}</td>
              <td className="py-1 pr-2 font-mono">
                <SinceNote provenance={provenance} path={`receivers[id=${receiver.id}].map[pin=${pin.pin}].failsafe`}>
                  {describeFailsafe(pin.failsafe)}
                </SinceNote>
              </td>
              <td className={pin.link_loss.kind === 'receiver-default' ? 'py-1 text-caution-700' : 'py-1'}>
                {pin.link_loss.words}
              </td>
            </tr>
          ))
        )}
      </tbody>
    </table>
  );
}
