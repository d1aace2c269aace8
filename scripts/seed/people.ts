// The demo club: invented people in invented places. Addresses use the reserved .test domain,
// so no mail can reach a real inbox. Coordinates sit over open sea on purpose, so no area
// stands for a real neighbourhood.
import type { Role } from '../../src/lib/club/roles';

export const CLUB_NAME = 'Kettlewater Aquatic Gardeners';

export interface DemoArea {
	name: string;
	lat: number;
	lng: number;
}

export const DEMO_AREAS: DemoArea[] = [
	{ name: 'Kettlewater Centre', lat: 55.2, lng: 3.2 },
	{ name: 'Mossbank', lat: 55.23, lng: 3.25 },
	{ name: 'Reedholme', lat: 55.17, lng: 3.14 },
	{ name: 'Alder Quay', lat: 55.21, lng: 3.31 },
	{ name: 'Fenwick Heights', lat: 55.28, lng: 3.18 },
	{ name: 'Brackenford', lat: 55.09, lng: 3.27 },
	{ name: 'Lowmarsh', lat: 55.36, lng: 3.44 }
];

export interface DemoPerson {
	key: string;
	email: string;
	displayName: string;
	role: Role;
	area: string;
	units: 'metric' | 'us' | 'imperial';
}

export const DEMO_PEOPLE: DemoPerson[] = [
	{ key: 'oriel', email: 'oriel.vantwist@kettlewater.test', displayName: 'Oriel Vantwist', role: 'admin', area: 'Kettlewater Centre', units: 'metric' },
	{ key: 'bramwell', email: 'bramwell.oduya@kettlewater.test', displayName: 'Bramwell Oduya', role: 'admin', area: 'Alder Quay', units: 'imperial' },
	{ key: 'sefa', email: 'sefa.lindqvoss@kettlewater.test', displayName: 'Sefa Lindqvoss', role: 'judge', area: 'Mossbank', units: 'metric' },
	{ key: 'tamsin', email: 'tamsin.haverel@kettlewater.test', displayName: 'Tamsin Haverel', role: 'judge', area: 'Fenwick Heights', units: 'metric' },
	{ key: 'ugo', email: 'ugo.pemberlake@kettlewater.test', displayName: 'Ugo Pemberlake', role: 'judge', area: 'Reedholme', units: 'us' },
	{ key: 'mara', email: 'mara.quillfeather@kettlewater.test', displayName: 'Mara Quillfeather', role: 'member', area: 'Reedholme', units: 'metric' },
	{ key: 'dov', email: 'dov.ashcombe@kettlewater.test', displayName: 'Dov Ashcombe', role: 'member', area: 'Mossbank', units: 'metric' },
	{ key: 'lio', email: 'lio.marchetty@kettlewater.test', displayName: 'Lio Marchetty', role: 'member', area: 'Brackenford', units: 'us' },
	{ key: 'fenna', email: 'fenna.brookhart@kettlewater.test', displayName: 'Fenna Brookhart', role: 'member', area: 'Alder Quay', units: 'metric' },
	{ key: 'joss', email: 'joss.okonkwe@kettlewater.test', displayName: 'Joss Okonkwe', role: 'member', area: 'Kettlewater Centre', units: 'metric' },
	{ key: 'ines', email: 'ines.calderwick@kettlewater.test', displayName: 'Ines Calderwick', role: 'member', area: 'Fenwick Heights', units: 'imperial' },
	{ key: 'rafe', email: 'rafe.tollemarsh@kettlewater.test', displayName: 'Rafe Tollemarsh', role: 'member', area: 'Lowmarsh', units: 'metric' },
	{ key: 'yara', email: 'yara.whitlowe@kettlewater.test', displayName: 'Yara Whitlowe', role: 'member', area: 'Mossbank', units: 'metric' },
	{ key: 'corin', email: 'corin.adebayo-lunt@kettlewater.test', displayName: 'Corin Adebayo-Lunt', role: 'member', area: 'Reedholme', units: 'metric' },
	{ key: 'nell', email: 'nell.sorrowby@kettlewater.test', displayName: 'Nell Sorrowby', role: 'member', area: 'Brackenford', units: 'metric' },
	{ key: 'pim', email: 'pim.eastergaard@kettlewater.test', displayName: 'Pim Eastergaard', role: 'member', area: 'Alder Quay', units: 'metric' }
];

const first = (role: Role) => DEMO_PEOPLE.find((p) => p.role === role)!;

/** Printed by `npm start`: one person per role to try the app as. */
export const DEMO_SIGN_IN = (['member', 'judge', 'admin'] as const).map((role) => {
	const person = role === 'member' ? DEMO_PEOPLE.find((p) => p.key === 'mara')! : first(role);
	return { role, email: person.email, name: person.displayName };
});
