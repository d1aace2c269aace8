import { describe, expect, test } from 'vitest';
import { describeTopic, topicFilter, TOPIC_KINDS } from './topics';

// The keys are those the features write (contests/announce.ts, contests/reminders.ts, swaps/mail.ts,
// journals/social.ts, journals/digest.ts).
describe('mail topics in words', () => {
	test('each key the features write reads as a label, never as the key', () => {
		const cases: [string, string][] = [
			['contest:13:results:entrant', 'Contest results: personal result'],
			['contest:13:results:announce', 'Contest results: announcement'],
			['contest:2:reminder', 'Contest reminder to admins'],
			['contest:2:nudge', 'Contest reminder to a judge'],
			['swap-listing:13', 'Swap listing changes'],
			['swap-thread:4:abc', 'Swap messages'],
			['swap-summary:abc', 'Swap messages, daily summaries'],
			['tank-follow:9', 'New journal entries for followers'],
			['journal-digest', 'Weekly journal digests']
		];
		for (const [key, label] of cases) expect(describeTopic(key)).toBe(label);
		expect(describeTopic(null)).toBe('Other mail');
		expect(describeTopic('something-new:1')).toBe('Other mail');
		expect(describeTopic('contest:3:later-kind')).toBe('Contest mail');
	});
	test('the filter takes only a known kind', () => {
		expect(topicFilter('swap-listing:')).toBe('swap-listing:');
		expect(topicFilter('swap-listing:13')).toBeUndefined();
		expect(topicFilter(undefined)).toBeUndefined();
		for (const k of TOPIC_KINDS) expect(k.label).not.toContain(':');
	});
});
