/**
 * What the caller may do on one spectrum's review, decided on the server (the page passes the
 * role's allowed actions from lib/auth/permissions and whether the caller submitted it). The
 * components only hide what the server would refuse; the server still checks every request.
 */
import type { Action } from '@/lib/auth/permissions';

export interface ReviewAbilities {
  waive: boolean;
  openThread: boolean;
  reply: boolean;
  markBlocking: boolean;
  resolve: boolean;
  /** Approve, return, reject: never on one's own submission. */
  decide: boolean;
  reopen: boolean;
  withdraw: boolean;
  assignReviewers: boolean;
  export: boolean;
  revise: boolean;
}

export function reviewAbilities(actions: readonly Action[], own: boolean): ReviewAbilities {
  const has = (a: Action) => actions.includes(a);
  return {
    waive: has('finding.waive'),
    openThread: has('thread.open'),
    reply: has('thread.reply') || (own && has('thread.reply-own')),
    markBlocking: has('thread.mark-blocking'),
    resolve: has('thread.resolve'),
    decide: has('spectrum.decide') && !own,
    reopen: has('spectrum.reopen'),
    withdraw: own && has('spectrum.withdraw-own'),
    assignReviewers: has('reviewers.assign'),
    export: has('spectrum.export'),
    revise: own && has('spectrum.revise-own'),
  };
}
