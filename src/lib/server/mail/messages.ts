// The words of the mails the foundation sends. Feature mails live with their features.
import { renderMail } from './templates';

export function signInMail(url: string, minutes: number) {
	const { html, text } = renderMail({
		heading: 'Your sign-in link',
		paragraphs: [
			'Someone (we hope you) asked to sign in to Riparia with this address.',
			`The button below signs you in. It works once and stops working after ${minutes} minutes.`,
			'If you did not ask for it, ignore this mail: nothing happens without the link.'
		],
		action: { label: 'Sign in to Riparia', url }
	});
	return { subject: 'Sign in to Riparia', html, text };
}
