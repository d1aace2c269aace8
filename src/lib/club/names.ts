/** What a member without a display name (or a former member) is called wherever names show. */
export const UNNAMED_MEMBER = 'A member';

/** A member's name as shown to others. */
export const nameOf = (displayName: string | null | undefined) => displayName?.trim() || UNNAMED_MEMBER;
