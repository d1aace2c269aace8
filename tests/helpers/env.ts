// What `npm test` tells the tests about the running stack.
function required(name: string): string {
	const value = process.env[name];
	if (!value) throw new Error(`${name} is not set: run the tests through \`npm test\`, which starts the stack.`);
	return value;
}

export const appUrl = () => required('APP_URL').replace(/\/$/, '');
export const mailApiUrl = () => required('MAIL_UI_URL').replace(/\/$/, '');
export const databaseUrl = () => required('DATABASE_URL');
