/** What a member without a display name is called wherever names show. */
export const UNNAMED_MEMBER = 'A member';

/** What a member who deleted their account (or was removed) is called where their past work stays. */
export const FORMER_MEMBER = 'Former member';

/** A member's name as shown to others. */
export const nameOf = (displayName: string | null | undefined, deleted = false) => (deleted ? FORMER_MEMBER : displayName?.trim() || UNNAMED_MEMBER);
