import { z } from 'zod';

const day = z
	.string()
	.regex(/^\d{4}-\d{2}-\d{2}$/)
	.refine((d) => !Number.isNaN(Date.parse(`${d}T00:00:00Z`)))
	.optional()
	.catch(undefined);

/** The audit page's filters as they come in the address (unknown values are ignored). */
export const auditQuery = z.object({
	actor: z.string().max(255).optional().catch(undefined),
	kind: z
		.string()
		.regex(/^[a-z][a-z0-9-]*(\.[a-z0-9-]+)?$/)
		.max(64)
		.optional()
		.catch(undefined),
	from: day,
	to: day,
	before: z.coerce.number().int().positive().optional().catch(undefined)
});
export type AuditQuery = z.output<typeof auditQuery>;

const DAY_MS = 86_400_000;

/** Calendar days (UTC, as the log shows times) to the instants the log is searched between: `to` counts whole. */
export function auditRange(query: Pick<AuditQuery, 'from' | 'to'>): { from?: Date; until?: Date } {
	return {
		from: query.from ? new Date(`${query.from}T00:00:00Z`) : undefined,
		until: query.to ? new Date(Date.parse(`${query.to}T00:00:00Z`) + DAY_MS) : undefined
	};
}

/** Kinds to filter by: every action recorded, and each group of them ("contest" for all contest steps). */
export function kindChoices(actions: readonly string[]): string[] {
	const groups = new Set(actions.filter((a) => a.includes('.')).map((a) => a.split('.')[0]!));
	return [...new Set([...groups, ...actions])].sort();
}
