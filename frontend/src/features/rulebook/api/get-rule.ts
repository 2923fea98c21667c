import { queryOptions, useQuery } from '@tanstack/react-query';
import type { RuleVersionDto } from '@amberline/common';
import { api } from '../../../lib/api-client';
import { rulebookKeys } from './keys';

export const getRule = (code: string) => api<RuleVersionDto>(`/rulebook/jurisdictions/${encodeURIComponent(code)}`);

export const ruleQueryOptions = (code: string) => queryOptions({ queryKey: rulebookKeys.current(code), queryFn: () => getRule(code) });

export const useRule = (code: string) => useQuery(ruleQueryOptions(code));
