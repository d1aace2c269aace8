// How an event reads on a page, in a feed and in mail: a label and one line of detail. A dose of
// a known salt in grams also says what it adds to the tank's water, from the dose calculator.
import { NUTRIENT_LABELS, SALTS, SALT_IDS, doseContribution, formatNumber, type Nutrient, type SaltId } from './calc';
import { ALGAE_LABELS, EVENT_LABELS, FILTER_PART_LABELS, type AlgaeKind, type EventKind, type FilterPart } from './journal-vocabulary';

export interface EventFacts {
	kind: EventKind;
	percent: number | null;
	filterPart: FilterPart | null;
	what: string;
	amount: number | null;
	amountUnit: string | null;
	saltId: string | null;
	speciesName: string;
	count: number | null;
	algaeKind: AlgaeKind | null;
	note: string;
}

const isSalt = (id: string | null): id is SaltId => id !== null && (SALT_IDS as readonly string[]).includes(id);

/** mg/L each nutrient a dose of a known salt adds to `litres`, when the amount is a mass. */
export function doseAdds(
	event: Pick<EventFacts, 'saltId' | 'amount' | 'amountUnit'>,
	litres: number | null
): { nutrient: Nutrient; label: string; mgPerL: number }[] {
	if (!isSalt(event.saltId) || event.amount === null || !litres || litres <= 0) return [];
	const grams = event.amountUnit === 'g' ? event.amount : event.amountUnit === 'mg' ? event.amount / 1000 : null;
	if (grams === null) return [];
	const adds = doseContribution(event.saltId, grams, litres);
	return (Object.entries(adds) as [Nutrient, number][])
		.filter(([nutrient]) => nutrient !== 'N' && nutrient !== 'P')
		.map(([nutrient, mgPerL]) => ({ nutrient, label: NUTRIENT_LABELS[nutrient], mgPerL }));
}

export function describeEvent(event: EventFacts, options: { litres?: number | null; upkeepLabel?: string } = {}): { label: string; detail: string } {
	const parts: string[] = [];
	const amount = event.amount !== null ? `${formatNumber(event.amount, { figures: 4 })}${event.amountUnit ? ` ${event.amountUnit}` : ''}` : '';
	switch (event.kind) {
		case 'water-change':
			if (event.percent !== null) parts.push(`${formatNumber(event.percent, { figures: 3 })} % of the water`);
			break;
		case 'top-up':
			if (event.amount !== null) parts.push(`${formatNumber(event.amount, { figures: 3 })} L of water added`);
			break;
		case 'filter-clean':
			if (event.filterPart) parts.push(FILTER_PART_LABELS[event.filterPart]);
			break;
		case 'trim':
		case 'media-change':
			if (event.what) parts.push(event.what);
			break;
		case 'dose': {
			const what = isSalt(event.saltId) ? `${SALTS[event.saltId].name} (${SALTS[event.saltId].formula})` : event.what;
			parts.push([amount, what].filter(Boolean).join(' of '));
			const adds = doseAdds(event, options.litres ?? null);
			if (adds.length) parts.push(`adds about ${adds.map((a) => `${formatNumber(a.mgPerL, { figures: 2 })} mg/L ${a.nutrient}`).join(', ')}`);
			break;
		}
		case 'plant-added':
		case 'plant-removed':
			parts.push(event.speciesName);
			break;
		case 'livestock-added':
		case 'livestock-removed':
			parts.push(`${event.count !== null ? `${event.count} × ` : ''}${event.speciesName}`);
			break;
		case 'algae':
			if (event.algaeKind) parts.push(ALGAE_LABELS[event.algaeKind]);
			break;
		case 'upkeep':
			parts.push(options.upkeepLabel || event.what);
			break;
	}
	if (event.note) parts.push(event.note);
	return { label: EVENT_LABELS[event.kind], detail: parts.filter(Boolean).join(' · ') };
}
