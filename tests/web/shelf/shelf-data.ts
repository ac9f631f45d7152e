import { parse } from 'yaml';
import { analyzeSetup } from '@shared/analyze';
import { findSlot, reuseCheck } from '@shared/reuse/reuse-check';
import { storedSettingsSchema } from '@shared/reuse/stored-settings';
import type { ReuseCheckView, ShelfUnit } from '@web/features/shelf/types';
import { CLUB } from '../fake-server';
import { fixtureText, uuid, type ModelRecord } from '../models/model-data';

// Shelf units as the API presents them, built from the stored-settings fixtures in
// fixtures/reuse/, and reuse checks computed by the real shared check against a model
// record's latest revision, as the server does.

export function unitRecord(fixture: string | null, extra: Partial<ShelfUnit> = {}): ShelfUnit {
  const raw = fixture ? (parse(fixtureText(`reuse/${fixture}.yaml`)) as Record<string, unknown>) : {};
  const stored = raw.stored_settings ? storedSettingsSchema.parse(raw.stored_settings) : null;
  return {
    id: uuid(7000),
    workspace_id: CLUB,
    label: (raw.label as string) ?? 'Spare unit',
    mark: (raw.mark as string) ?? null,
    mark_colour: (raw.mark_colour as ShelfUnit['mark_colour']) ?? null,
    outputs: (raw.outputs as number) ?? 8,
    notes: '',
    short_code: 'K7QF3M',
    stored_settings: stored,
    settings_recorded_at: stored ? '2026-04-20T18:00:00.000Z' : null,
    telemetry: stored ? stored.telemetry : null,
    status: 'free',
    installed: null,
    readiness: null,
    created_at: '2026-04-20T18:00:00.000Z',
    updated_at: '2026-04-20T18:00:00.000Z',
    ...extra,
  };
}

export function checkFor(unit: ShelfUnit, model: ModelRecord, slotId: string): ReuseCheckView {
  const revision = model.revisions[model.revisions.length - 1];
  const analysis = analyzeSetup(revision.yaml);
  const slot = findSlot(analysis.setup!, slotId)!;
  const check = reuseCheck({ outputs: unit.outputs, stored: unit.stored_settings }, slot, analysis.findings);
  return {
    receiver_id: unit.id,
    model: { id: model.id, name: model.name },
    revision: { id: revision.id, number: revision.number, content_hash: revision.content_hash },
    ...check,
    installed_here: unit.installed?.model.id === model.id && unit.installed.slot === slotId,
    holder:
      unit.installed?.model.id === model.id && unit.installed.slot === slotId
        ? { id: unit.id, label: unit.label }
        : null,
  };
}

export const history = { installs: [], events: [] };
