/** Field limits shared by the server's DTOs and the browser's forms. */
export const LIMITS = {
  emailMax: 254,
  nameMax: 120,
  passwordMin: 8,
  passwordMax: 128,
  pageSizeMax: 100,
  /** Highest page number a list accepts (keeps the row offset a small whole number). */
  pageMax: 100_000,
} as const;
