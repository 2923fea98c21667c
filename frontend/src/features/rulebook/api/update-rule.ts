import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { RuleVersionDto, UpdateRuleRequest } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { rulebookKeys } from './keys';

/** Saves a new version of the jurisdiction's record; older versions stay for the assessments that used them. */
export const updateRule = ({ code, ...body }: UpdateRuleRequest & { code: string }) =>
  api<RuleVersionDto>(`/rulebook/jurisdictions/${encodeURIComponent(code)}`, { method: 'PUT', json: body });

export const useUpdateRule = () => {
  const qc = useQueryClient();
  return useMutation({ mutationFn: updateRule, onSuccess: () => qc.invalidateQueries({ queryKey: rulebookKeys.all() }) });
};
