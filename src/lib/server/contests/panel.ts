// The judging panel of a contest: who judges it. Admins assign and take off judges until the
// results are out; every change is in the contest's audit log.
import { and, eq } from 'drizzle-orm';
import { resolve, type Context } from '../context';
import type { Viewer } from '../club/users';
import * as directory from '../club/directory';
import * as audit from '../audit';
import { conflict, DomainError } from '../../errors';
import type { ContestState } from '../../contests/lifecycle';
import { contestJudges } from './schema';
import { adminChange, assertAdmin, auditSubject, type AdminStep } from './contests';

/** The ids of the contest's judges. */
export async function panelIds(contestId: number, context: Context = {}): Promise<string[]> {
	const { db } = resolve(context);
	return (await db.select({ judgeId: contestJudges.judgeId }).from(contestJudges).where(eq(contestJudges.contestId, contestId))).map((r) => r.judgeId);
}

/** Members with the judge role who are not on the contest's panel, by name: whom the admin may add. */
export async function candidates(viewer: Viewer, contestId: number, context: Context = {}): Promise<directory.Member[]> {
	assertAdmin(viewer);
	const onPanel = new Set(await panelIds(contestId, context));
	return (await directory.withRole('judge', context)).filter((j) => !onPanel.has(j.id));
}

const panelClosed = (state: ContestState) => state === 'published' || state === 'archived';

/** An admin's change of the panel, while it may still change. */
function changePanel(viewer: Viewer, contestId: number, context: Context, change: (on: AdminStep) => Promise<void>): Promise<void> {
	return adminChange(viewer, contestId, context, async (on) => {
		if (panelClosed(on.contest.state)) throw conflict('panel-closed', 'The results are out; the panel can no longer change.');
		await change(on);
	});
}

export async function assign(viewer: Viewer, contestId: number, judgeId: string, context: Context = {}): Promise<void> {
	await changePanel(viewer, contestId, context, async ({ tx, context: inTx }) => {
		const person = (await directory.byIds([judgeId], inTx)).get(judgeId);
		if (!person || person.role !== 'judge') throw new DomainError(400, 'not-a-judge', 'Only members with the judge role can be assigned.');
		const [existing] = await tx
			.select()
			.from(contestJudges)
			.where(and(eq(contestJudges.contestId, contestId), eq(contestJudges.judgeId, judgeId)));
		if (existing) return;
		await tx.insert(contestJudges).values({ contestId, judgeId, assignedBy: viewer.id, ...(context.now ? { assignedAt: context.now } : {}) });
		await audit.record({ actorId: viewer.id, action: 'panel.assign', subject: auditSubject(contestId), detail: { judgeId, judge: person.name } }, inTx);
	});
}

/** Takes a judge off the panel; their cards are kept but no longer count. */
export async function unassign(viewer: Viewer, contestId: number, judgeId: string, context: Context = {}): Promise<void> {
	await changePanel(viewer, contestId, context, async ({ tx, context: inTx }) => {
		const [result] = await tx.delete(contestJudges).where(and(eq(contestJudges.contestId, contestId), eq(contestJudges.judgeId, judgeId)));
		if (result.affectedRows === 0) return;
		const name = (await directory.names([judgeId], inTx)).get(judgeId) ?? null;
		await audit.record({ actorId: viewer.id, action: 'panel.unassign', subject: auditSubject(contestId), detail: { judgeId, judge: name } }, inTx);
	});
}
