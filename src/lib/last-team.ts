// Remembers the team last opened in this browser, so "/" and the personal
// pages (mail, settings) keep the team the person was working in.
const KEY = 'arcbench.lastTeamId';

export function rememberTeam(teamId: string): void {
  try {
    localStorage.setItem(KEY, teamId);
  } catch {
    // Private windows may refuse storage; remembering is only a convenience.
  }
}

export function lastTeamId(): string | null {
  try {
    return localStorage.getItem(KEY);
  } catch {
    return null;
  }
}
