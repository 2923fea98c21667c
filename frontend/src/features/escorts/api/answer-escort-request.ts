import { useMutation } from '@tanstack/react-query';
import type { EscortAnswer, EscortAnswerResult } from '@amberline/common';
import { api } from '../../../lib/api-client';

/** Public: the vendor's one answer through the link. */
export const answerEscortRequest = ({ token, ...body }: EscortAnswer & { token: string }) =>
  api<EscortAnswerResult>(`/escort-responses/${encodeURIComponent(token)}`, { method: 'POST', json: body });

export const useAnswerEscortRequest = () => useMutation({ mutationFn: answerEscortRequest });
