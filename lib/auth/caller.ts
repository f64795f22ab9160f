/** Who is making a request: a signed-in person, or a script with one of their API tokens. */
export interface Caller {
  userId: string;
  email: string;
  name: string | null;
  via: 'session' | 'token';
  /** Set for token callers: the token reaches this group only. */
  tokenId?: string;
  tokenGroupId?: string;
}

/** The signed-in person as pages and actions see them. */
export interface SessionUser {
  id: string;
  email: string;
  name: string | null;
}

export function callerFromUser(user: SessionUser): Caller {
  return { userId: user.id, email: user.email, name: user.name, via: 'session' };
}
