/** The address a unit's label points at: its page on the shelf (sign-in first returns there). */
export const unitAddress = (origin: string, workspaceId: string, unitId: string): string =>
  `${origin}/w/${encodeURIComponent(workspaceId)}/shelf/${encodeURIComponent(unitId)}`;

/** The short code as printed: two groups of three, easier to read out and type. */
export const printedCode = (code: string): string => `${code.slice(0, 3)} ${code.slice(3)}`;
