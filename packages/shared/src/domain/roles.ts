/** A member's roles in the guild (PRODUCT.md): every member is `member`; officers add theirs. */
export const ROLES = ['member', 'librarian', 'treasurer', 'admin'] as const;
