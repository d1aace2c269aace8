import { describe, expect, test } from 'vitest';
import { commentCount, threadComments } from './comment-thread';

const c = (id: number, parentId: number | null = null) => ({ id, parentId });

describe('threadComments', () => {
	test('replies go under the comment they answer, in the order given', () => {
		const threads = threadComments([c(1), c(2), c(3, 1), c(4, 2), c(5, 1)]);
		expect(threads).toEqual([
			{ ...c(1), replies: [c(3, 1), c(5, 1)] },
			{ ...c(2), replies: [c(4, 2)] }
		]);
		expect(commentCount(threads)).toBe(5);
	});
	test('a reply to a comment not in the list is left out; no comments, no threads', () => {
		expect(threadComments([c(7, 99), c(8)])).toEqual([{ ...c(8), replies: [] }]);
		expect(threadComments([])).toEqual([]);
		expect(commentCount([])).toBe(0);
	});
});
