// The admin's forms for club areas: a name and a centre point in decimal degrees.
import { z } from 'zod';

export const AREA_NAME_MAX = 80;

export const areaName = z.string().trim().min(2, 'Use at least 2 characters.').max(AREA_NAME_MAX, `Keep it to ${AREA_NAME_MAX} characters.`);

/** A decimal degree as typed: a comma is taken as the decimal point. */
const coordinate = (min: number, max: number, label: string) =>
	z
		.string()
		.trim()
		.transform((v) => Number(v.replace(',', '.')))
		.refine((v) => Number.isFinite(v) && v >= min && v <= max, `${label} is a number from ${min} to ${max}.`);

const areaId = z.coerce.number({ message: 'Choose an area.' }).int('Choose an area.').nonnegative('Choose an area.');

export const newAreaForm = z.object({ name: areaName, lat: coordinate(-90, 90, 'Latitude'), lng: coordinate(-180, 180, 'Longitude') });
export const renameAreaForm = z.object({ id: areaId, name: areaName });
export const removeAreaForm = z.object({ id: areaId });
