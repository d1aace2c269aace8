import { z } from 'zod';
import { isTimeZone } from '../dates';
import { DISPLAY_NAME_MAX, DISPLAY_NAME_MIN, UNIT_SYSTEMS } from './roles';
import { composed } from '../text';

export const displayNameSchema = z
	.string()
	.overwrite(composed)
	.min(DISPLAY_NAME_MIN, `Use at least ${DISPLAY_NAME_MIN} characters.`)
	.max(DISPLAY_NAME_MAX, `Keep it to ${DISPLAY_NAME_MAX} characters.`)
	.regex(/^[\p{L}\p{N}][\p{L}\p{N} .'’_-]*$/u, "Use letters, numbers, spaces and . ' - _ only.");

const optionalNumber = (min: number, max: number, label: string) =>
	z
		.string()
		.trim()
		.transform((v) => (v === '' ? null : Number(v.replace(',', '.'))))
		.refine((v) => v === null || (Number.isFinite(v) && v >= min && v <= max), `${label} must be a number from ${min} to ${max}.`);

/** An IANA time zone name this runtime knows ("Europe/Lisbon"), as chosen or as a browser reports it. */
export const timeZoneSchema = z
	.string()
	.trim()
	.max(64, 'Choose a time zone from the list.')
	.refine((v) => /^[A-Za-z][A-Za-z0-9_+\-/]*$/.test(v) && isTimeZone(v), 'Choose a time zone from the list, such as Europe/Lisbon.');

export const profileSchema = z
	.object({
		displayName: displayNameSchema,
		units: z.enum(UNIT_SYSTEMS, { message: 'Choose a unit system.' }),
		/** Absent: the stored zone stays as it is. */
		timeZone: timeZoneSchema.optional(),
		locationMode: z.enum(['none', 'area', 'point']),
		homeAreaId: z
			.string()
			.optional()
			.transform((v) => (v ? Number(v) : null)),
		homeLat: optionalNumber(-90, 90, 'Latitude'),
		homeLng: optionalNumber(-180, 180, 'Longitude')
	})
	.superRefine((v, ctx) => {
		if (v.locationMode === 'area' && !v.homeAreaId) ctx.addIssue({ code: 'custom', path: ['homeAreaId'], message: 'Choose one of the club areas.' });
		if (v.locationMode === 'point' && (v.homeLat === null || v.homeLng === null)) {
			ctx.addIssue({ code: 'custom', path: [v.homeLat === null ? 'homeLat' : 'homeLng'], message: 'Give both latitude and longitude.' });
		}
	});

/** The profile form as the server receives it. */
export type ProfileInput = z.output<typeof profileSchema>;
