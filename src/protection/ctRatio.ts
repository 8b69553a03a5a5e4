// Settings in CT secondary amperes and back: the document stores primary amperes.
import type { Relay } from "./types.ts";

/** Primary amperes to CT secondary amperes for this relay's CT. */
export function toSecondary_A(relay: Pick<Relay, "ctPrimary_A" | "ctSecondary_A">, primary_A: number): number {
  return (primary_A * relay.ctSecondary_A) / relay.ctPrimary_A;
}

/** CT secondary amperes to primary amperes for this relay's CT. */
export function toPrimary_A(relay: Pick<Relay, "ctPrimary_A" | "ctSecondary_A">, secondary_A: number): number {
  return (secondary_A * relay.ctPrimary_A) / relay.ctSecondary_A;
}

/** A pickup as a multiple of the CT primary rating (the "x In" many relays display). */
export function toCtMultiple(relay: Pick<Relay, "ctPrimary_A">, primary_A: number): number {
  return primary_A / relay.ctPrimary_A;
}
