export type Severity = 'error' | 'warning' | 'info';

export interface Finding {
  rule: string;
  severity: Severity;
  message: string;
  hint: string;
  path: string;
  /** 1-based */
  line: number;
  /** 1-based */
  column: number;
}

export interface FindingCounts {
  errors: number;
  warnings: number;
  infos: number;
}

export function countFindings(findings: readonly Pick<Finding, 'severity'>[]): FindingCounts {
  const counts: FindingCounts = { errors: 0, warnings: 0, infos: 0 };
  for (const finding of findings) {
    if (finding.severity === 'error') counts.errors += 1;
    else if (finding.severity === 'warning') counts.warnings += 1;
    else counts.infos += 1;
  }
  return counts;
}
