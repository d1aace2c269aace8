// The contest entry form's server side, shared by the enter and edit pages: what the form offers
// (the categories with their rules, the member's tanks with what each category says of them) and
// what it shows again when an entry is refused (the fields as typed, the photos it named).
import type { RequestEvent } from '@sveltejs/kit';
import type { Viewer } from '$lib/server/club/users';
import { requireUser } from '$lib/server/club/guards';
import * as media from '$lib/server/media';
import * as contests from '$lib/server/contests/contests';
import * as contestEntries from '$lib/server/contests/contest-entries';
import { describeRule, roundLitres } from '$lib/contests/eligibility';
import { formatVolume } from '$lib/journals/calc/units';
import { contestEntryDraftOf, contestEntryPhotosOf, type EntryCategoryChoice, type EntryTankChoice } from '$lib/contests/contest-entry-form';

/** What the enter and edit pages both list: the categories with their rules, and the member's tanks. */
export async function entryChoices(viewer: Viewer, contest: contests.ContestDetail): Promise<{ categories: EntryCategoryChoice[]; tanks: EntryTankChoice[] }> {
	const options = await contestEntries.tankOptions(viewer, contest);
	return {
		categories: contest.categories.map((c) => ({ id: c.id, name: c.name, description: c.description, rule: describeRule(contests.ruleOf(c), viewer.units) })),
		tanks: options.map((t) => ({
			id: t.id,
			name: t.name,
			thumb: t.cover?.urls.thumb ?? null,
			litres: t.facts.litres === null ? null : roundLitres(t.facts.litres),
			volume: t.facts.litres === null ? null : formatVolume(roundLitres(t.facts.litres), viewer.units),
			volumeSource: t.facts.volumeSource,
			ageLabel: t.ageLabel,
			retired: t.facts.retired,
			eligibility: t.eligibility,
			enteredAs: t.enteredAs
		}))
	};
}

/** What a refused entry form shows again: the fields as typed and the photos it named (of the entry being changed, if any). */
export const entryFormAgain = (entryIdOf: (event: RequestEvent) => number | null) => async (data: FormData, event: RequestEvent) => {
	const entryId = entryIdOf(event);
	return {
		...contestEntryDraftOf(data),
		photos: await media.photosAgain(requireUser(event).id, contestEntryPhotosOf(data), entryId === null ? null : { scope: contestEntries.SCOPE, id: entryId })
	};
};
