import { describe, expect, test } from 'vitest';
import { DomainError } from '../errors';
import { assertRole, hasRole, onlyFor } from './roles';

describe('roles', () => {
	const member = { role: 'member' as const };
	const judge = { role: 'judge' as const };
	const admin = { role: 'admin' as const };

	test('hasRole is true only for a signed-in person holding one of the roles', () => {
		expect(hasRole(admin, 'admin')).toBe(true);
		expect(hasRole(judge, 'judge', 'admin')).toBe(true);
		expect(hasRole(member, 'judge', 'admin')).toBe(false);
		expect(hasRole(null, 'member')).toBe(false);
		expect(hasRole(undefined, 'member', 'judge', 'admin')).toBe(false);
	});

	test('assertRole refuses with a 403 that names who may', () => {
		expect(() => assertRole(admin, 'admin')).not.toThrow();
		let refusal: unknown;
		try {
			assertRole(member, 'judge', 'admin');
		} catch (e) {
			refusal = e;
		}
		expect(refusal).toBeInstanceOf(DomainError);
		expect(refusal).toMatchObject({ status: 403, code: 'forbidden', message: 'This part of Riparia is for judges and admins only.' });
	});

	test('the refusal sentence lists the roles in the order given', () => {
		expect(onlyFor(['admin'])).toBe('This part of Riparia is for admins only.');
	});
});
