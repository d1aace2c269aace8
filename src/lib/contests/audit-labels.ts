// How the contest's audit log reads on the admin page.
const LABELS: Record<string, string> = {
	'contest.create': 'Created the contest',
	'contest.edit': 'Edited the contest',
	'contest.open-entries': 'Opened entries',
	'contest.start-judging': 'Closed entries and started judging',
	'contest.publish': 'Published the results',
	'contest.archive': 'Archived the contest',
	'contest.rank-by': 'Changed the ranking basis',
	'panel.assign': 'Assigned a judge',
	'panel.unassign': 'Took a judge off the panel',
	'panel.remind': 'Reminded judges',
	'judge.conflict': 'Declared a conflict',
	'entry.withdraw': 'Withdrew an entry',
	'results.amend-card': 'Corrected a card after publication',
	'results.rank-by': 'Changed the ranking basis after publication',
	'results.announce': 'Sent the results announcement'
};

export const auditLabel = (action: string) => LABELS[action] ?? action;

/** A short line of the detail worth reading: the reason, the judge, the entry number. */
export function auditDetail(detail: Record<string, unknown>): string {
	const bits: string[] = [];
	if (typeof detail.judge === 'string') bits.push(detail.judge);
	if (typeof detail.number === 'number') bits.push(`entry ${detail.number}`);
	if (typeof detail.entryNumber === 'number') bits.push(`entry ${detail.entryNumber}`);
	if (Array.isArray(detail.judges)) bits.push((detail.judges as string[]).join(', '));
	if (Array.isArray(detail.missing) && detail.missing.length) bits.push(`${detail.missing.length} cards missing`);
	if (typeof detail.overrideReason === 'string') bits.push(`reason: ${detail.overrideReason}`);
	if (typeof detail.reason === 'string' && detail.reason) bits.push(`reason: ${detail.reason}`);
	if (typeof detail.revision === 'number') bits.push(`revision ${detail.revision}`);
	return bits.join(' · ');
}
