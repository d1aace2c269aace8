// The admin's progress matrix: a row per entry, a cell per judge of the panel.

/** One judge's card for one entry: not owed (their own entry, a conflict), or how far it got. */
export type MatrixCell = 'self' | 'conflicted' | 'empty' | 'draft' | 'submitted';

export interface ProgressMatrix {
	judges: { id: string; name: string; submitted: number; expected: number }[];
	rows: { entryId: number; number: number | null; category: string; entrant: string; cells: MatrixCell[] }[];
}
