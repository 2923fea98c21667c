import { DomainError } from '@amberline/common';

/** The DomainError a service call is refused with; fails the test when the call succeeds or throws anything else. */
export async function refusal(p: Promise<unknown>): Promise<DomainError> {
  const e = await p.then(
    () => new Error('expected a refusal, the call succeeded'),
    (x: unknown) => x,
  );
  expect(e).toBeInstanceOf(DomainError);
  return e as DomainError;
}
