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
  /** The pilot's reason, when the setup's `accepted` list accepts this warning or info. */
  accepted?: string;
  /** Set when a club rule changed the check's severity: "club rule: warning raised to error". */
  club_rule?: string;
}

export interface FindingCounts {
  errors: number;
  warnings: number;
  infos: number;
}

/** Open findings by severity, and the accepted ones apart. */
export interface AnalysisCounts extends FindingCounts {
  accepted: number;
}

/** Counts the open findings by severity; accepted findings are counted apart, not as open. */
export function countFindings(findings: readonly Pick<Finding, 'severity' | 'accepted'>[]): AnalysisCounts {
  const counts: AnalysisCounts = { errors: 0, warnings: 0, infos: 0, accepted: 0 };
  for (const finding of findings) {
    if (finding.accepted !== undefined) counts.accepted += 1;
    else if (finding.severity === 'error') counts.errors += 1;
    else if (finding.severity === 'warning') counts.warnings += 1;
    else counts.infos += 1;
  }
  return counts;
}
