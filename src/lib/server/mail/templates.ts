// One layout for every application mail: a heading, paragraphs, an optional button, a footer.
// Features write their own words and pass them in; this module only handles markup and escaping.
// Mail to a member names its recipient and category (`to`): the footer then links the member's
// notification settings and, for a category they may turn off, that category's unsubscribe link.
import { CATEGORY_TEXT, type MailCategory } from '../../mail/categories';
import { absoluteLinks } from '../../journals/atom';
import { config } from '../config';
import { settingsUrl, unsubscribeUrl } from './unsubscribe';

export interface MailContent {
	heading: string;
	paragraphs: string[];
	/** Sanitised HTML (a stored rendering of members' or admins' markdown) shown after the paragraphs, its site-relative links made absolute on ORIGIN (a mail has no base address); `text` stands for it in the plain part. */
	rich?: { html: string; text: string };
	action?: { label: string; url: string };
	/** Shown under the action, e.g. "You get this because you follow …". */
	footer?: string;
	/** The member it goes to and the category it belongs to; mail to no member (a goodbye) has none. */
	to?: { memberId: string; category: MailCategory };
}

export const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

export function renderMail(content: MailContent): { html: string; text: string } {
	const paragraphs = content.paragraphs.map((p) => `<p style="margin:0 0 14px">${escapeHtml(p)}</p>`).join('');
	const action = content.action
		? `<p style="margin:22px 0"><a href="${escapeHtml(content.action.url)}" style="background:#1e5b47;color:#ffffff;padding:11px 18px;border-radius:6px;text-decoration:none;font-weight:600">${escapeHtml(content.action.label)}</a></p>
<p style="margin:0 0 14px;font-size:13px;color:#4a5a52">Or open this address: ${escapeHtml(content.action.url)}</p>`
		: '';
	const settings = content.to ? settingsUrl() : undefined;
	const category = content.to && content.to.category !== 'account' ? content.to.category : undefined;
	const unsubscribe = category ? { url: unsubscribeUrl(content.to!.memberId, category), noun: CATEGORY_TEXT[category].noun } : undefined;
	const link = (url: string, label: string) => `<a href="${escapeHtml(url)}" style="color:#4a5a52">${escapeHtml(label)}</a>`;
	const footerBits = [
		content.footer ? escapeHtml(content.footer) : '',
		settings ? link(settings, 'Choose which mail you get') : '',
		unsubscribe ? link(unsubscribe.url, `Unsubscribe from ${unsubscribe.noun}`) : ''
	].filter(Boolean);
	const html = `<!doctype html><html lang="en"><body style="margin:0;background:#f3f5f0;font-family:Georgia,'Times New Roman',serif;color:#1b2a23">
<table role="presentation" width="100%" cellpadding="0" cellspacing="0"><tr><td align="center" style="padding:24px 12px">
<table role="presentation" width="100%" style="max-width:560px;background:#ffffff;border-radius:8px;border:1px solid #dbe3da" cellpadding="0" cellspacing="0">
<tr><td style="padding:18px 24px;border-bottom:3px solid #7fb38f;font-size:20px;font-weight:700;color:#1e5b47">Riparia</td></tr>
<tr><td style="padding:24px;font-family:Arial,Helvetica,sans-serif;font-size:15px;line-height:1.55">
<h1 style="font-family:Georgia,serif;font-size:21px;margin:0 0 16px;color:#1b2a23">${escapeHtml(content.heading)}</h1>
${paragraphs}${content.rich ? `<div>${absoluteLinks(content.rich.html, config().ORIGIN)}</div>` : ''}${action}
</td></tr>
${footerBits.length ? `<tr><td style="padding:14px 24px;border-top:1px solid #e6ebe4;font-family:Arial,sans-serif;font-size:12px;color:#4a5a52">${footerBits.join('<br>')}</td></tr>` : ''}
</table></td></tr></table></body></html>`;

	const text = [
		content.heading,
		'='.repeat(Math.min(content.heading.length, 60)),
		'',
		...content.paragraphs.flatMap((p) => [p, '']),
		...(content.rich ? [content.rich.text, ''] : []),
		...(content.action ? [`${content.action.label}: ${content.action.url}`, ''] : []),
		...(content.footer || settings ? ['--'] : []),
		...(content.footer ? [content.footer] : []),
		...(settings ? [`Choose which mail you get: ${settings}`] : []),
		...(unsubscribe ? [`Unsubscribe from ${unsubscribe.noun}: ${unsubscribe.url}`] : [])
	].join('\n');
	return { html, text };
}
