import { queryOptions, useQuery } from '@tanstack/react-query';
import type { RuleVersionDto } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { rulebookKeys } from './keys';

export const getRuleVersions = (code: string) => api<RuleVersionDto[]>(`/rulebook/jurisdictions/${encodeURIComponent(code)}/versions`);

export const ruleVersionsQueryOptions = (code: string) =>
  queryOptions({ queryKey: rulebookKeys.versions(code), queryFn: () => getRuleVersions(code) });

export const useRuleVersions = (code: string) => useQuery(ruleVersionsQueryOptions(code));
