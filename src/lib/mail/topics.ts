// What each outbox topic key means, in words for the admin's mail log. Keys are written by the
// features that queue mail ("contest:7:results:entrant", "swap-listing:13"); admins see these labels.

export interface TopicKind {
	/** The start of the keys of this kind, used as the log's filter. */
	prefix: string;
	label: string;
}

/** The kinds of mail the filter offers, in the order shown. */
export const TOPIC_KINDS: readonly TopicKind[] = [
	{ prefix: 'contest:', label: 'Contests' },
	{ prefix: 'swap-thread:', label: 'Swap messages' },
	{ prefix: 'swap-summary:', label: 'Swap messages, daily summaries' },
	{ prefix: 'swap-listing:', label: 'Swap listing changes' },
	{ prefix: 'tank-follow:', label: 'New journal entries for followers' },
	{ prefix: 'journal-digest', label: 'Weekly journal digests' }
];

const CONTEST_PARTS: Record<string, string> = {
	'results:entrant': 'Contest results: personal result',
	'results:announce': 'Contest results: announcement',
	reminder: 'Contest reminder to admins',
	nudge: 'Contest reminder to a judge'
};

/** A topic key as the admin reads it; an unknown or missing key is "Other mail". */
export function describeTopic(topic: string | null | undefined): string {
	if (!topic) return 'Other mail';
	const contest = /^contest:\d+:(.+)$/.exec(topic);
	if (contest) return CONTEST_PARTS[contest[1]!] ?? 'Contest mail';
	return TOPIC_KINDS.find((k) => k.prefix !== 'contest:' && topic.startsWith(k.prefix))?.label ?? 'Other mail';
}

/** Only a known kind's prefix is a filter; anything else typed into the address is ignored. */
export const topicFilter = (value: string | undefined) => TOPIC_KINDS.find((k) => k.prefix === value)?.prefix;
