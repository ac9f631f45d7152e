import { analyzeSetup } from '@shared/analyze';
import { evaluate, type LinkLoss, type Outputs } from '@shared/evaluate/evaluate';
import { fromRest } from '@shared/evaluate/rest';
import type { Setup } from '@shared/format/schema';
import { findingLine, readCommandLine } from './command-line';
import { failUnreadable, readSetupFile } from './read-setup-file';

// `npm run --silent outputs -- FILE [--set CONTROL=VALUE ...] [--lost RECEIVER ...] [--json]`
// (docs/format.md, "Command line"): the bench view. Axes, knobs and sliders take a percent,
// switches a 0-based position; unset controls sit at rest (evaluation rule 8: 0 or
// position 0, a throttle's stick at its stop). --lost takes receivers off the link
// (rule 9); `--lost all` takes every one.

const USAGE = 'usage: npm run --silent outputs -- FILE [--set CONTROL=VALUE ...] [--lost RECEIVER|all ...] [--json]';

type Loss = { ok: true; lost: LinkLoss } | { ok: false; message: string };

function parseLost(setup: Setup, ids: readonly string[]): Loss {
  if (ids.includes('all')) return { ok: true, lost: 'all' };
  const known = new Set(setup.receivers.map((receiver) => receiver.id));
  const unknown = ids.find((id) => !known.has(id));
  if (unknown !== undefined)
    return {
      ok: false,
      message: `--lost ${unknown}: no receiver ${unknown} (receivers: ${[...known].join(', ')}, or all)`,
    };
  return { ok: true, lost: new Set(ids) };
}

type Settings = { ok: true; positions: Record<string, number> } | { ok: false; message: string };

function parseSettings(setup: Setup, sets: readonly string[]): Settings {
  const positions: Record<string, number> = {};
  for (const set of sets) {
    const eq = set.indexOf('=');
    if (eq <= 0) return { ok: false, message: `--set ${set}: expected CONTROL=VALUE` };
    const id = set.slice(0, eq);
    const raw = set.slice(eq + 1).trim();
    const control = setup.controls.find((candidate) => candidate.id === id);
    if (!control) {
      return {
        ok: false,
        message: `--set ${set}: no control ${id} (controls: ${setup.controls.map((c) => c.id).join(', ')})`,
      };
    }
    const value = raw === '' ? Number.NaN : Number(raw);
    if (control.kind === 'switch') {
      if (!Number.isInteger(value) || value < 0 || value >= control.positions) {
        return {
          ok: false,
          message: `--set ${set}: ${id} is a switch; give a position from 0 to ${control.positions - 1}`,
        };
      }
    } else if (!Number.isFinite(value) || value < -100 || value > 100) {
      return {
        ok: false,
        message: `--set ${set}: ${id} is ${control.kind === 'axis' ? 'an' : 'a'} ${control.kind}; give a percent from -100 to 100`,
      };
    }
    positions[id] = value;
  }
  return { ok: true, positions };
}

function signed(value: number): string {
  return `${value > 0 ? '+' : ''}${value.toFixed(1)} %`;
}

function describeFailsafe(failsafe: Outputs['receivers'][number]['pins'][number]['failsafe']): string {
  if (failsafe === null) return 'receiver default';
  return typeof failsafe === 'number' ? `${failsafe} µs` : failsafe;
}

function humanOutputs(outputs: Outputs): string {
  const width = Math.max(8, ...outputs.channels.map((c) => c.function.length));
  const lines = ['Channels', `  ${'ch'.padStart(3)}  ${'function'.padEnd(width)}  ${'value'.padStart(9)}  pulse`];
  for (const c of outputs.channels) {
    lines.push(
      `  ${String(c.ch).padStart(3)}  ${c.function.padEnd(width)}  ${signed(c.value).padStart(9)}  ${c.pulse_us} µs`,
    );
  }
  for (const receiver of outputs.receivers) {
    lines.push('', `Receiver ${receiver.id}${receiver.lost ? ' (link lost: failsafe)' : ''}`);
    for (const pin of receiver.pins) {
      const pulse = pin.pulse_us === null ? 'no pulses' : `${pin.pulse_us} µs`;
      lines.push(
        `  pin ${String(pin.pin).padStart(2)}  ch ${String(pin.ch).padStart(2)}  ${pulse}  failsafe ${describeFailsafe(pin.failsafe)}`,
      );
    }
  }
  return lines.join('\n');
}

function main(argv: string[]): number {
  const args = readCommandLine(argv, { usage: USAGE, files: 1, takesSet: true });
  if (!args.ok) return args.exitCode;
  const { json, sets } = args;

  const file = readSetupFile(args.files[0]);
  if (!file.ok) return failUnreadable(json, file.message);

  const analysis = analyzeSetup(file.text);
  if (!analysis.setup) {
    // Without a schema-valid setup there is nothing to evaluate; the findings say why.
    const message = `${file.file}: the setup has ${analysis.readable ? 'schema' : 'syntax'} errors and cannot be evaluated`;
    if (json) process.stdout.write(`${JSON.stringify({ error: { message }, findings: analysis.findings })}\n`);
    else {
      const lines = analysis.findings.filter((f) => f.severity === 'error').map(findingLine);
      process.stderr.write(`${[...lines, message].join('\n')}\n`);
    }
    return 1;
  }

  const settings = parseSettings(analysis.setup, sets);
  if (!settings.ok) return failUnreadable(json, `${settings.message}\n${USAGE}`);

  const loss = parseLost(analysis.setup, args.lost);
  if (!loss.ok) return failUnreadable(json, `${loss.message}\n${USAGE}`);

  const outputs = evaluate(analysis.setup, fromRest(analysis.setup, settings.positions), loss.lost);
  if (json) process.stdout.write(`${JSON.stringify(outputs)}\n`);
  else {
    let text = humanOutputs(outputs);
    if (analysis.counts.errors > 0)
      text += `\n\n${file.file} has ${analysis.counts.errors} error(s); run check for details.`;
    process.stdout.write(`${text}\n`);
  }
  return analysis.counts.errors > 0 ? 1 : 0;
}

process.exitCode = main(process.argv.slice(2));
