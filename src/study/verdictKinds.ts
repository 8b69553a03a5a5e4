// The verdict kinds, one registry: the full study and the single-case request run every kind listed here,
// and the type is derived from it. `perCase` kinds are judged from one case's simulated operation;
// the others need the whole scenario (load flow).
export const VERDICT_KIND_INFO = {
  sensitivity: { perCase: true, title: "Sensitivity", means: "each device of the expected isolation operates, with margin over its pickup at the minimum fault" },
  selectivity: { perCase: true, title: "Selectivity", means: "no device outside the expected isolation opens before the fault is isolated; backups keep the CTI" },
  backup: { perCase: true, title: "Backup", means: "with an expected breaker stuck, the backups isolate the fault within the horizon and the equipment's withstand" },
  speed: { perCase: true, title: "Speed", means: "the fault is isolated within the zone's clearing limit and every piece of equipment's withstand" },
  blinding: { perCase: true, title: "Blinding", means: "an infeed between source and fault does not keep an expected device from operating" },
  sympathetic: { perCase: true, title: "Sympathetic tripping", means: "a healthy feeder's device does not trip on current flowing back to the fault" },
  duty: { perCase: false, title: "Duty", means: "each breaker and fuse with ratings can break and make the short-circuit current at its bus" },
  load: { perCase: false, title: "Load", means: "pickups stay above the load-flow current with margin" },
} as const;

export type VerdictKind = keyof typeof VERDICT_KIND_INFO;
export const VERDICT_KINDS = Object.keys(VERDICT_KIND_INFO) as VerdictKind[];
