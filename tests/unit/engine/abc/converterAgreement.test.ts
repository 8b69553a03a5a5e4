// Full-size converter units (inverters) in the engine's IEC treatment against the IEC 60909-0:2016 superposition
// for a three-phase fault, I"k = (c Un / sqrt(3) + sum_j |Z_kj| I_kPFj) / |Z_kk| with I_kPF = iMax Ir
// (// from memory, as listed in /work/shared/reference-checks.md), evaluated with impedances that the independent
// phase-domain reference computes: Z_kk and the transfer impedances Z_kj are the positive-sequence voltages at the
// fault bus for a unit positive-sequence current injected at the fault bus and at each converter's bus, on the network
// without its converters and with every source voltage at zero (independent computation with mathjs).
import { describe, it, expect } from "vitest";
import fc from "fast-check";
import type { Complex } from "mathjs";
import { compileNetwork, solveFault } from "../../../../src/engine/index.ts";
import type { Project } from "../../../../src/model/schema.ts";
import { phaseDomainFault } from "./phaseDomainFault.ts";
import { A_OP, phaseToSequence } from "./symmetricalComponents.ts";
import { smallInverterCase } from "./smallInverterCase.ts";
import { complex, multiply } from "mathjs";

const positive = (): Complex[] => [complex(1, 0), multiply(A_OP, A_OP) as Complex, A_OP];

/** |Z_kj| (pu) seen from bus k for an injection at bus j, network without converters, sources at zero voltage. */
function transferZ(project: Project, k: string, j: string): number {
  const s = phaseDomainFault(
    project,
    { bus: k, type: "none", injections: [{ bus: j, phase_pu: positive() }] },
    { scenario: "s", gridSk: "max", gridC: 1, prefault_pu: 0, generatorSeqR: "rx", equivalentSource: true, omitKinds: ["inverter"] },
  );
  const v1 = phaseToSequence(s.busVoltage_pu.get(k) as Complex[])[1];
  return Math.hypot(v1.re, v1.im);
}

describe("full-size converters, IEC 60909 superposition, three-phase fault (classic method, prefault 1 pu)", () => {
  it("gives I\"k = (E + sum |Z_kj| I_kPFj) / |Z_kk| with impedances from the phase-domain reference", () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 2 ** 31 - 1 }), (seed) => {
        const k = smallInverterCase(seed);
        const compiled = compileNetwork(k.project, { scenario: "s", limit: "max", method: "classic" });
        if (!compiled.ok) throw new Error(compiled.errors.map((e) => e.text).join("; "));
        const eng = solveFault(compiled.network, { kind: "bus", bus: k.bus }, "3ph", { inverterModel: "iec", faultR_ohm: 0, faultX_ohm: 0 }); // bolted, as the formula
        const un = new Map(k.project.elements.flatMap((e) => (e.kind === "bus" ? [[e.id, e.un_kV] as const] : [])));
        const zkk = transferZ(k.project, k.bus, k.bus);
        let sum = 0;
        for (const e of k.project.elements) {
          if (e.kind !== "inverter") continue;
          const ikpf_pu = e.iMax_pu * (e.sr_MVA / k.project.meta.baseMVA) * ((un.get(e.bus) as number) / e.ur_kV);
          sum += transferZ(k.project, k.bus, e.bus) * ikpf_pu;
        }
        const baseA_kA = 100 / (Math.sqrt(3) * (un.get(k.bus) as number));
        const expected_kA = ((1 + sum) / zkk) * baseA_kA;
        expect(Math.abs(eng.ikss_kA - expected_kA) / baseA_kA, `seed ${seed} at ${k.bus}`).toBeLessThan(1e-9);
        expect(eng.inverter?.iec.ikss_kA ?? Number.NaN, `seed ${seed}: IEC outcome`).toBeCloseTo(expected_kA, 9);
      }),
      { numRuns: 40 },
    );
  });
});
