// The engine's refined inverter model, checked from outside: whatever currents its converters settle on, the rest
// of the network must be the linear network driven by those currents (substitution theorem). The reference replaces
// every inverter by the terminal current the engine reports for it and solves the phase-domain network again; fault
// currents, bus voltages and branch currents must agree to 1e-9 pu, the reported terminal voltage of each unit must be
// the one the reference finds there, and no grid-following unit may exceed its current limit iMax.
// Sources: substitution theorem and symmetrical components (Fortescue 1918); independent computation with mathjs.
import { describe, it, expect } from "vitest";
import fc from "fast-check";
import { complex, type Complex } from "mathjs";
import { compileNetwork, solveFault, FAULT_TYPES, type Phasor } from "../../../../src/engine/index.ts";
import { phaseDomainFault } from "./phaseDomainFault.ts";
import { phaseToSequence } from "./symmetricalComponents.ts";
import { smallInverterCase } from "./smallInverterCase.ts";

const TOL_PU = 1e-9;
const toC = (p: Phasor): Complex => complex(p.mag * Math.cos((p.ang_deg * Math.PI) / 180), p.mag * Math.sin((p.ang_deg * Math.PI) / 180));
const dist = (a: Complex, b: Complex) => Math.hypot(a.re - b.re, a.im - b.im);

describe("refined inverter model: the network around the converters is the linear network driven by their currents", () => {
  it("agrees with the phase-domain reference fed with the engine's converter currents, all fault types", () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 2 ** 31 - 1 }), fc.constantFrom(...FAULT_TYPES), fc.boolean(), (seed, type, mix) => {
        const k = smallInverterCase(seed, mix);
        const compiled = compileNetwork(k.project, { scenario: "s", limit: "max", method: "classic" });
        if (!compiled.ok) throw new Error(compiled.errors.map((e) => e.text).join("; "));
        const zf = k.base.zf_ohm;
        const eng = solveFault(compiled.network, { kind: "bus", bus: k.bus }, type, { inverterModel: "refined", faultR_ohm: zf.re, faultX_ohm: zf.im });
        const where = `seed ${seed}, mix ${mix}, ${type} at ${k.bus}`;
        expect(eng.inverter?.used, where).toBe("refined");
        const un = new Map(k.project.elements.flatMap((e) => (e.kind === "bus" ? [[e.id, e.un_kV] as const] : [])));
        const baseA = (bus: string) => (k.project.meta.baseMVA * 1e3) / (Math.sqrt(3) * (un.get(bus) as number));
        const inverterIds = new Set(k.project.elements.filter((e) => e.kind === "inverter").map((e) => e.id));
        const injections = eng.shunts
          .filter((s) => inverterIds.has(s.element))
          .map((s) => ({ bus: s.bus, frame: "fault" as const, phase_pu: s.phase_A.map((p) => complex(-toC(p).re / baseA(s.bus), -toC(p).im / baseA(s.bus))) }));
        // Every in-service inverter must report its terminal current, or the substitution is incomplete.
        expect(injections.length, where).toBe(inverterIds.size);
        const ref = phaseDomainFault(k.project, { bus: k.bus, type, zf_ohm: zf, injections }, { scenario: "s", generatorSeqR: "rx", omitKinds: ["inverter"] });
        let worst = 0;
        let at = "";
        const note = (d: number, w: string) => {
          if (!(d <= worst)) {
            worst = Number.isNaN(d) ? Infinity : d;
            at = w;
          }
        };
        for (let p = 0; p < 3; p++) note(dist(toC(eng.faultPhase_kA[p]), ref.fault_kA[p]) / (baseA(k.bus) / 1000), `fault phase ${p}`);
        for (const bv of eng.buses) {
          const mine = ref.busVoltage_pu.get(bv.bus) as Complex[];
          for (let p = 0; p < 3; p++) note(dist(toC(bv.phase_pu[p]), mine[p]), `voltage ${bv.bus} phase ${p}`);
        }
        for (const e of eng.branchEnds) {
          const mine = ref.ends.find((x) => x.element === e.element && x.end === e.end);
          for (let p = 0; p < 3; p++) note(mine ? dist(toC(e.phase_A[p]), mine.phase_A[p]) / baseA(e.bus) : Infinity, `current ${e.element} ${e.end} phase ${p}`);
        }
        expect(worst, `${where}: ${at}`).toBeLessThan(TOL_PU);
        // Terminal voltage and current limit of each unit (the limit is the model's own rule: |I| <= iMax Ir).
        for (const u of eng.inverter?.refined.units ?? []) {
          const rec = k.project.elements.find((e) => e.id === u.element);
          if (!rec || rec.kind !== "inverter") continue;
          const v1 = phaseToSequence(ref.busVoltage_pu.get(rec.bus) as Complex[])[1];
          expect(Math.abs(u.v1_pu - Math.hypot(v1.re, v1.im) * ((un.get(rec.bus) as number) / rec.ur_kV)), `${where}: v1 of ${u.element}`).toBeLessThan(1e-6);
          if (rec.control === "grid-following") {
            const term = eng.shunts.find((s) => s.element === u.element);
            const iMaxA = rec.iMax_pu * (rec.sr_MVA * 1000) / (Math.sqrt(3) * rec.ur_kV);
            for (const p of term?.phase_A ?? []) expect(p.mag, `${where}: ${u.element} phase current over iMax`).toBeLessThanOrEqual(iMaxA * (1 + 1e-6));
          }
        }
      }),
      { numRuns: 40 },
    );
  });
});
