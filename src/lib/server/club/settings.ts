// The club's own settings: its name, description, contact address and how people join. One row;
// until an admin saves it the club runs on defaults from the configuration (open to all, as
// before the settings existed).
import { eq } from 'drizzle-orm';
import { assertRole } from '../../club/roles';
import type { JoinPolicy } from '../../club/membership';
import type { SettingsInput } from '../../club/settings-form';
import type { Viewer } from '../../club/viewer';
import * as audit from '../audit';
import { config } from '../config';
import { resolve, within, type Context } from '../context';
import { renderMarkdown } from '../markdown';
import { clubSettings } from './schema';

export interface ClubSettings {
	name: string;
	description: string;
	descriptionHtml: string;
	contactEmail: string;
	joinPolicy: JoinPolicy;
	updatedAt: Date | null;
}

const ROW_ID = 1;

function defaults(): ClubSettings {
	const settings = config();
	return {
		name: settings.CLUB_NAME,
		description: '',
		descriptionHtml: '',
		contactEmail: settings.ADMIN_EMAIL ?? /<([^>]+)>/.exec(settings.MAIL_FROM)?.[1] ?? settings.MAIL_FROM,
		joinPolicy: 'open',
		updatedAt: null
	};
}

export async function get(context: Context = {}): Promise<ClubSettings> {
	const { db } = resolve(context);
	const [row] = await db.select().from(clubSettings).where(eq(clubSettings.id, ROW_ID)).limit(1);
	if (!row) return defaults();
	return {
		name: row.name,
		description: row.description,
		descriptionHtml: row.descriptionHtml,
		contactEmail: row.contactEmail,
		joinPolicy: row.joinPolicy,
		updatedAt: row.updatedAt
	};
}

/** How people join today. */
export const joinPolicy = async (context: Context = {}): Promise<JoinPolicy> => (await get(context)).joinPolicy;

/**
 * Saves the settings (admins only). The description's HTML is rendered and sanitised once, here,
 * and stored beside the markdown. The change is audited with the fields that changed.
 */
export async function save(admin: Viewer, input: SettingsInput, context: Context = {}): Promise<void> {
	assertRole(admin, 'admin');
	const { db, now } = resolve(context);
	const descriptionHtml = renderMarkdown(input.description, { images: false });
	await db.transaction(async (tx) => {
		const [existing] = await tx.select().from(clubSettings).where(eq(clubSettings.id, ROW_ID)).for('update');
		const before: ClubSettings = existing ?? defaults();
		const values = { ...input, descriptionHtml, updatedAt: now, updatedBy: admin.id };
		if (existing) await tx.update(clubSettings).set(values).where(eq(clubSettings.id, ROW_ID));
		else await tx.insert(clubSettings).values({ id: ROW_ID, ...values });
		const keys = (['name', 'description', 'contactEmail', 'joinPolicy'] as const).filter((k) => before[k] !== input[k]);
		if (keys.length === 0) return;
		await audit.record(
			{
				actorId: admin.id,
				action: 'club.settings',
				subject: { type: 'club', id: ROW_ID },
				before: Object.fromEntries(keys.map((k) => [k, before[k]])),
				after: Object.fromEntries(keys.map((k) => [k, input[k]]))
			},
			within(context, tx)
		);
	});
}
