import { ApiError, isRunSheetChanged, isVersionConflict } from './api-client';

const err = (status: number, body: Partial<ConstructorParameters<typeof ApiError>[1]> = {}) =>
  new ApiError(status, { statusCode: status, error: 'conflict', message: 'refused', ...body });

describe('ApiError', () => {
  it('exposes the domain code of the body', () => {
    expect(err(409, { code: 'version_conflict' }).code).toBe('version_conflict');
    expect(err(400).code).toBeUndefined();
  });

  it('lists field errors only when details are a list', () => {
    expect(err(400, { error: 'validation_failed', details: [{ field: 'customer', reason: 'required' }] }).fieldErrors()).toEqual([{ name: 'customer', errors: ['required'] }]);
    expect(err(409, { details: { currentVersion: 3 } }).fieldErrors()).toEqual([]);
  });
});

describe('isVersionConflict', () => {
  it.each([
    ['the code', err(409, { code: 'version_conflict' }), true],
    ['another code, even with a current version', err(409, { code: 'transition_refused', details: { currentVersion: 3 } }), false],
    ['no code, a 409 with the current version', err(409, { details: { currentVersion: 3 } }), true],
    ['no code, a 409 without it', err(409), false],
    ['no code, another status', err(400, { details: { currentVersion: 3 } }), false],
    ['no code, whatever the wording', err(409, { message: 'This move was changed by someone else' }), false],
    ['not an API error', new Error('changed by someone else'), false],
  ])('%s', (_case, e, expected) => {
    expect(isVersionConflict(e)).toBe(expected);
  });
});

describe('isRunSheetChanged', () => {
  it.each([
    ['the code', err(409, { code: 'run_sheet_changed' }), true],
    ['another code', err(409, { code: 'precondition_unmet' }), false],
    ['no code, a 409 without details', err(409), true],
    ['no code, a 409 with details', err(409, { details: { unmet: [] } }), false],
    ['no code, another status', err(404), false],
    ['not an API error', new Error('changed'), false],
  ])('%s', (_case, e, expected) => {
    expect(isRunSheetChanged(e)).toBe(expected);
  });
});
