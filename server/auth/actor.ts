/** Who is changing something, and in which team: what a service needs to scope a write and audit it. */
export interface Actor {
  teamId: string;
  userId: string;
}
