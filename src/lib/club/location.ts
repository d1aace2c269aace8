// Members' home points are kept only roughly: two decimal places of a degree is about 1.1 km
// north-south (and less east-west away from the equator), enough for "about 4 km away".

export interface LatLng {
	lat: number;
	lng: number;
}

export const LOCATION_DECIMALS = 2;

export function roundToKilometre(point: LatLng): LatLng {
	const factor = 10 ** LOCATION_DECIMALS;
	const round = (v: number) => Math.round(v * factor) / factor;
	// Normalise the longitude so -180 and 180 are one place.
	const lng = round(((((point.lng + 180) % 360) + 360) % 360) - 180);
	return { lat: round(Math.max(-90, Math.min(90, point.lat))), lng: lng === -180 ? 180 : lng };
}
