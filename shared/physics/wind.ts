// Wind relative to the line of fire, and the part of it the planar flight
// model can use.
//
// Convention (stated in the API and on the form): windFromDeg is the direction
// the wind blows FROM, as meteorology gives it, but measured from the line of
// fire, clockwise seen from above: 0° = a headwind (from downrange towards the
// launcher), 90° = from the right of the line of fire, 180° = a tailwind,
// 270° = from the left.
//
// The flight model (flight.ts) takes a steady horizontal wind along +x, +x
// being downrange: a = −k |v − w| (v − w) − g ŷ. The along-plane component of
// a wind of speed s from angle φ is therefore  w_x = −s · cos φ  (a headwind
// is negative). The crosswind, s · sin φ, carries the body out of the plane;
// over a short clip that drift is small against the distance to the camera and
// is not modelled.

export interface WindRelativeToLine {
  speedMps: number;
  /** Direction the wind comes from, degrees clockwise from the line of fire (0 = headwind). */
  fromDeg: number;
}

export interface WindComponents {
  /** Along the line of fire, positive downrange (tailwind): FlightModel.windXMps. */
  alongMps: number;
  /** Across the line of fire, positive blowing from right to left. */
  crossMps: number;
}

export function windComponents({ speedMps, fromDeg }: WindRelativeToLine): WindComponents {
  if (!(Number.isFinite(speedMps) && speedMps >= 0)) throw new RangeError('wind speed must be 0 or more m/s');
  if (!Number.isFinite(fromDeg)) throw new RangeError('wind direction must be a number of degrees');
  const phi = (fromDeg * Math.PI) / 180;
  // Exact zeros at the quarter points, so a pure crosswind adds no along-plane wind.
  const cos = Math.abs(Math.cos(phi)) < 1e-15 ? 0 : Math.cos(phi);
  const sin = Math.abs(Math.sin(phi)) < 1e-15 ? 0 : Math.sin(phi);
  return { alongMps: cos === 0 ? 0 : -speedMps * cos, crossMps: sin === 0 ? 0 : speedMps * sin };
}

/** The along-plane wind the flight model uses (FlightModel.windXMps). */
export function alongPlaneWindMps(wind: WindRelativeToLine | null | undefined): number {
  return wind ? windComponents(wind).alongMps : 0;
}
