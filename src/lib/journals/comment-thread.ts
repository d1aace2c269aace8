// Comments under a journal entry as the page shows them: comments on the entry in the order
// given, each followed by its replies (one level), also in the order given.

export type Threaded<C> = C & { replies: C[] };

/** Groups replies under the comment they answer; a reply whose comment is not in the list is left out. */
export function threadComments<C extends { id: number; parentId: number | null }>(comments: readonly C[]): Threaded<C>[] {
	const top = comments.filter((c) => c.parentId === null).map((c) => ({ ...c, replies: [] as C[] }));
	const byId = new Map(top.map((c) => [c.id, c]));
	for (const c of comments) if (c.parentId !== null) byId.get(c.parentId)?.replies.push(c);
	return top;
}

/** Comments and replies together, for the heading's count. */
export const commentCount = (threads: readonly { replies: readonly unknown[] }[]) => threads.reduce((n, t) => n + 1 + t.replies.length, 0);
