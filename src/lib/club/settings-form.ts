import { z } from 'zod';
import { JOIN_POLICIES } from './membership';

export const DESCRIPTION_MAX = 4000;

/** The club settings form, shared by the page and the server. */
export const settingsForm = z.object({
	name: z.string().trim().min(2, 'Give the club a name of at least two characters.').max(80, 'Keep the name under 80 characters.'),
	description: z.string().trim().max(DESCRIPTION_MAX, `Keep the description under ${DESCRIPTION_MAX} characters.`),
	contactEmail: z.string().trim().toLowerCase().max(254, 'That address is too long.').email('Enter an address like committee@example.org.'),
	joinPolicy: z.enum(JOIN_POLICIES, { message: 'Choose how people join.' })
});
export type SettingsInput = z.output<typeof settingsForm>;
