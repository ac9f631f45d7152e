import { useMemo } from 'react';
import { setupSchema } from '@shared/format/schema';
import { useRevision } from '../../models/api/get-revision';
import { changedCurves } from '../changed-curves';
import { MixCurveChange } from './mix-curve-change';

/**
 * The changed mixes' curves, before and after, for two revisions. The compare answer
 * carries no documents, so both revisions are read (each is cached for good: a stored
 * revision never changes). Nothing shows while they load, or when either is not
 * schema-valid, or when no curve changed.
 */
export function ChangedCurvesView({ fromId, toId }: { fromId: string; toId: string }) {
  const from = useRevision(fromId);
  const to = useRevision(toId);
  const curves = useMemo(() => {
    if (!from.data || !to.data) return [];
    const before = setupSchema.safeParse(from.data.document);
    const after = setupSchema.safeParse(to.data.document);
    return before.success && after.success ? changedCurves(before.data, after.data) : [];
  }, [from.data, to.data]);
  if (curves.length === 0) return null;
  return (
    <section aria-labelledby="changed-curves-heading" className="mt-4">
      <h3 id="changed-curves-heading" className="mb-2 text-base font-semibold text-ink-900">
        Changed mix curves
      </h3>
      <p className="mb-2 max-w-prose text-sm text-ink-700">
        Each changed mix's output against its input, the older revision dashed and the newer solid.
      </p>
      <div className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-5">
        {curves.map((curve) => (
          <MixCurveChange key={`${curve.mixId}-${curve.rates?.position ?? 0}`} curve={curve} />
        ))}
      </div>
    </section>
  );
}
