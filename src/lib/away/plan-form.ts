// The form that starts an away period: the days, feeding and light, how the keeper hears of visits,
// how to reach the keeper, and
// the evaporation when the keeper knows it better than the logged top-ups do.
import { z } from 'zod';
import { FEEDING_CHOICES, LIGHTING_CHOICES, VISIT_MAIL_CHOICES } from './vocabulary';

const day = (message: string) =>
	z
		.string({ message })
		.trim()
		.regex(/^\d{4}-\d{2}-\d{2}$/, message)
		.refine((v) => !Number.isNaN(Date.parse(`${v}T00:00:00Z`)) && new Date(`${v}T00:00:00Z`).toISOString().startsWith(v), message);

export const awayPlanForm = z.object({
	startsOn: day('Give the day you leave.'),
	endsOn: day('Give the day you are back.'),
	feeding: z.enum(FEEDING_CHOICES, { message: 'Choose how the animals are fed.' }),
	lighting: z.enum(LIGHTING_CHOICES, { message: 'Choose what happens to the light.' }),
	visitMail: z.enum(VISIT_MAIL_CHOICES, { message: 'Choose how you hear of visits.' }).default('each'),
	keeperPhone: z
		.string()
		.trim()
		.max(40, 'Keep the number to 40 characters.')
		.regex(/^[0-9+()\-. ]*$/, 'Use digits, spaces and + ( ) - . only.')
		.default(''),
	evaporationLitresPerDay: z
		.string()
		.trim()
		.default('')
		.transform((v) => (v === '' ? null : Number(v.replace(',', '.'))))
		.refine((v) => v === null || (Number.isFinite(v) && v >= 0 && v <= 50), 'Give litres a day, from 0 to 50, or leave it empty.')
});

export type AwayPlanInput = z.output<typeof awayPlanForm>;
