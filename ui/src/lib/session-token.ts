// The access token lives here (and in localStorage, so a reload keeps the session) as a tiny
// external store: the api client reads it, React subscribes to it through useSyncExternalStore.
const STORAGE_KEY = 'beamwright.session';

interface StoredSession {
  accessToken: string;
  /** epoch milliseconds after which the token is no longer accepted by the api */
  expiresAtMs: number | null;
}

type Listener = () => void;
const listeners = new Set<Listener>();

function read(): StoredSession | null {
  try {
    const raw = window.localStorage.getItem(STORAGE_KEY);
    if (!raw) return null;
    const parsed = JSON.parse(raw) as Partial<StoredSession>;
    if (typeof parsed.accessToken !== 'string' || parsed.accessToken.length === 0) return null;
    return { accessToken: parsed.accessToken, expiresAtMs: typeof parsed.expiresAtMs === 'number' ? parsed.expiresAtMs : null };
  } catch {
    return null;
  }
}

function notify() {
  for (const listener of listeners) listener();
}

/** The current token, or null when signed out or expired (an expired token is dropped). */
export function getSessionToken(): string | null {
  const session = read();
  if (!session) return null;
  if (session.expiresAtMs !== null && session.expiresAtMs <= Date.now()) {
    window.localStorage.removeItem(STORAGE_KEY);
    return null;
  }
  return session.accessToken;
}

export function setSessionToken(accessToken: string, expiresInS?: number) {
  const session: StoredSession = {
    accessToken,
    expiresAtMs: typeof expiresInS === 'number' && Number.isFinite(expiresInS) ? Date.now() + expiresInS * 1000 : null,
  };
  window.localStorage.setItem(STORAGE_KEY, JSON.stringify(session));
  notify();
}

export function clearSessionToken() {
  const hadToken = window.localStorage.getItem(STORAGE_KEY) !== null;
  window.localStorage.removeItem(STORAGE_KEY);
  if (hadToken) notify();
}

export function subscribeToSessionToken(listener: Listener): () => void {
  listeners.add(listener);
  // Another tab signing in or out changes the same storage key.
  const onStorage = (event: StorageEvent) => {
    if (event.key === STORAGE_KEY) listener();
  };
  window.addEventListener('storage', onStorage);
  return () => {
    listeners.delete(listener);
    window.removeEventListener('storage', onStorage);
  };
}
