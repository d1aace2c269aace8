// The pages the benchmark drives, found in whichever database it is given (the demo club or the
// large one): the busiest tank, the published category with most entries, the judge with most
// cards in a contest being judged, the longest conversation, the member who follows most tanks,
// and the member living nearest the middle of the open listings. Each viewer gets a database
// session the way Auth.js makes one (a `session` row and its cookie).
import { randomUUID } from 'node:crypto';
import mysql from 'mysql2/promise';

export const SESSION_COOKIE = 'authjs.session-token';

export type PageKey = 'baseline' | 'showcase' | 'tank' | 'nearby' | 'results' | 'card' | 'conversation' | 'dashboard' | 'viewer';

export interface Target {
	key: PageKey;
	label: string;
	path: string;
	/** Cookie header for a signed-in request; null for a signed-out one. */
	cookie: string | null;
	/** A page a browser renders (JS and CSS are weighed), rather than a JSON API. */
	page: boolean;
}

type Row = Record<string, unknown>;

async function one(conn: mysql.Connection, what: string, sql: string, params: unknown[] = []): Promise<Row> {
	const [rows] = (await conn.query(sql, params)) as unknown as [Row[]];
	if (!rows[0]) throw new Error(`The benchmark found no ${what} in this database.`);
	return rows[0];
}

export async function findTargets(databaseUrl: string): Promise<Target[]> {
	const conn = await mysql.createConnection({ uri: databaseUrl });
	try {
		const tank = await one(
			conn,
			'tank with entries',
			`SELECT t.id FROM tank t JOIN journal_entry e ON e.tank_id = t.id WHERE t.visibility <> 'private' GROUP BY t.id ORDER BY COUNT(*) DESC, t.id LIMIT 1`
		);
		const centre = await one(conn, 'open listing', `SELECT AVG(lat) AS lat, AVG(lng) AS lng FROM listing WHERE state = 'open'`);
		const nearby = await one(
			conn,
			'member with a location',
			`SELECT id FROM user WHERE home_lat IS NOT NULL AND role = 'member'
			 ORDER BY POW(home_lat - ?, 2) + POW((home_lng - ?) * COS(RADIANS(?)), 2), id LIMIT 1`,
			[centre.lat, centre.lng, centre.lat]
		);
		const results = await one(
			conn,
			'published contest',
			`SELECT c.id AS contest, e.category_id AS category FROM contest c JOIN contest_entry e ON e.contest_id = c.id
			 WHERE c.state = 'published' GROUP BY c.id, e.category_id ORDER BY COUNT(*) DESC, c.id DESC LIMIT 1`
		);
		const card = await one(
			conn,
			'judge with cards in a contest being judged',
			`SELECT k.contest_id AS contest, e.number, k.judge_id AS judge FROM contest_card k
			 JOIN contest_entry e ON e.id = k.entry_id JOIN contest c ON c.id = k.contest_id JOIN user u ON u.id = k.judge_id
			 WHERE c.state = 'judging' AND u.role = 'judge' AND e.number IS NOT NULL
			 ORDER BY (SELECT COUNT(*) FROM contest_card x WHERE x.judge_id = k.judge_id AND x.contest_id = k.contest_id) DESC, e.number LIMIT 1`
		);
		const thread = await one(
			conn,
			'conversation',
			`SELECT t.id, t.requester_id AS viewer FROM swap_thread t JOIN swap_message m ON m.thread_id = t.id GROUP BY t.id ORDER BY COUNT(*) DESC, t.id LIMIT 1`
		);
		const dashboard = await one(
			conn,
			'member who follows tanks',
			`SELECT user_id AS id FROM tank_follow GROUP BY user_id ORDER BY COUNT(*) DESC, user_id LIMIT 1`
		);

		const cookies = new Map<string, string>();
		const cookieFor = async (userId: string) => {
			let cookie = cookies.get(userId);
			if (!cookie) {
				const token = randomUUID();
				await conn.query('INSERT INTO session (sessionToken, userId, expires) VALUES (?, ?, ?)', [token, userId, new Date(Date.now() + 2 * 86_400_000)]);
				cookie = `${SESSION_COOKIE}=${token}`;
				cookies.set(userId, cookie);
			}
			return cookie;
		};
		const member = await cookieFor(String(nearby.id));
		return [
			{ key: 'baseline', label: 'baseline: sign-in page, signed out (no SQL)', path: '/signin', cookie: null, page: true },
			{ key: 'showcase', label: 'showcase, signed out', path: '/journals/showcase', cookie: null, page: true },
			{ key: 'tank', label: 'busiest tank page', path: `/journals/${tank.id}`, cookie: member, page: true },
			{ key: 'nearby', label: 'nearby listings API, 10 km', path: '/api/swaps/listings?radius=10', cookie: member, page: false },
			{ key: 'results', label: 'published results, signed out', path: `/contests/${results.contest}/results/${results.category}`, cookie: null, page: true },
			{
				key: 'card',
				label: "judge's card API",
				path: `/api/judging/${card.contest}/${card.number}/card`,
				cookie: await cookieFor(String(card.judge)),
				page: false
			},
			{ key: 'conversation', label: 'longest conversation', path: `/swaps/threads/${thread.id}`, cookie: await cookieFor(String(thread.viewer)), page: true },
			{ key: 'dashboard', label: 'signed-in dashboard', path: '/', cookie: await cookieFor(String(dashboard.id)), page: true },
			{ key: 'viewer', label: 'resolving a signed-in viewer (/api/me)', path: '/api/me', cookie: member, page: false }
		];
	} finally {
		await conn.end();
	}
}
