// Every mail the club sends belongs to one category. Mail about the member's own account (a
// sign-in link, a goodbye, a download that is ready, a test of a post they wrote) is always sent;
// each other category is the member's choice on the notification settings page, and its mail
// carries a signed link that turns just that category off.
import { z } from 'zod';

export const OPTIONAL_CATEGORIES = ['swaps', 'comments', 'follows', 'upkeep', 'news', 'results', 'judging'] as const;
export type OptionalCategory = (typeof OPTIONAL_CATEGORIES)[number];
export type MailCategory = 'account' | OptionalCategory;

/** The choices of each category; the first is what "on" means for a one-click "subscribe again". */
export const CHOICES = {
	swaps: ['immediately', 'daily', 'off'],
	comments: ['on', 'off'],
	follows: ['daily', 'off'],
	upkeep: ['weekly', 'off'],
	news: ['on', 'off'],
	results: ['on', 'off'],
	judging: ['on', 'off']
} as const satisfies Record<OptionalCategory, readonly [string, ...string[]]>;

export type Preferences = { [C in OptionalCategory]: (typeof CHOICES)[C][number] };

/** A member who never changed a setting. The upkeep digest is asked for, everything else comes. */
export const DEFAULT_PREFERENCES: Preferences = {
	swaps: 'immediately',
	comments: 'on',
	follows: 'daily',
	upkeep: 'off',
	news: 'on',
	results: 'on',
	judging: 'on'
};

export const isOptionalCategory = (value: string): value is OptionalCategory => (OPTIONAL_CATEGORIES as readonly string[]).includes(value);

/** Whether mail of this category goes to a member with these settings. */
export function takes(preferences: Preferences, category: MailCategory): boolean {
	return category === 'account' || preferences[category] !== 'off';
}

/** The setting a category is given when a member turns it back on from an unsubscribe page. */
export const onValue = <C extends OptionalCategory>(category: C): Preferences[C] => CHOICES[category][0] as Preferences[C];

interface CategoryText {
	label: string;
	/** What the member gets, for the settings page. */
	hint: string;
	/** For the unsubscribe page and footers: "… stop <noun>". */
	noun: string;
	/** Only members with one of these roles see the setting. */
	roles?: readonly string[];
}

export const CATEGORY_TEXT: Record<OptionalCategory, CategoryText> = {
	swaps: {
		label: 'Swap messages',
		hint: 'New messages in swap conversations you are part of, and changes to listings you asked about.',
		noun: 'mail about swap messages'
	},
	comments: {
		label: 'Comments on my entries',
		hint: 'When someone comments on one of your journal entries or replies to your comment.',
		noun: 'mail about comments on your entries'
	},
	follows: {
		label: 'Tanks I follow',
		hint: 'New journal entries in tanks you follow: at most one mail a day per tank.',
		noun: 'mail about tanks you follow'
	},
	upkeep: {
		label: 'Upkeep reminders',
		hint: 'A Monday mail listing the maintenance due on your tanks in the coming week.',
		noun: 'the weekly upkeep reminder'
	},
	news: { label: 'Club news', hint: 'Posts the club’s admins send to members.', noun: 'club news' },
	results: {
		label: 'Contest results',
		hint: 'The results of club contests, and your own place and feedback when you entered.',
		noun: 'mail about contest results'
	},
	judging: {
		label: 'Judging reminders',
		hint: 'Reminders about cards you still owe as a judge, and, for admins, contest dates that passed.',
		noun: 'judging reminders',
		roles: ['judge', 'admin']
	}
};

export const CHOICE_TEXT: Record<string, string> = {
	immediately: 'Soon after each message (at most one mail per conversation an hour)',
	daily: 'A daily digest',
	weekly: 'Weekly',
	on: 'On',
	off: 'Off'
};

/** The categories a member with this role sees on the settings page. */
export const categoriesFor = (role: string): OptionalCategory[] =>
	OPTIONAL_CATEGORIES.filter((c) => !CATEGORY_TEXT[c].roles || CATEGORY_TEXT[c].roles.includes(role));

/**
 * The settings form. A category the member does not see (judging, for a member) keeps its stored
 * value: it is absent from the form and so absent from the result.
 */
export const preferencesForm = z.object(
	Object.fromEntries(OPTIONAL_CATEGORIES.map((c) => [c, z.enum(CHOICES[c], { message: 'Choose one of the options.' }).optional()])) as unknown as {
		[C in OptionalCategory]: z.ZodOptional<z.ZodEnum<{ [K in (typeof CHOICES)[C][number]]: K }>>;
	}
);
export type PreferencesInput = z.output<typeof preferencesForm>;
