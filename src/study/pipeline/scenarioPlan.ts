// Pass 1 of a scenario's study: its network graph, protection zones, and for every fault location and
// fault type the expected isolation with its stuck-breaker variants. None of this depends on currents,
// so it is worked out once per location and type and shared by both limits.
import type { Project, Scenario } from "../../model/schema.ts";
import { deviceSides, type ProtectedSide } from "../deviceSides.ts";
import { faultLocations } from "../faultCases.ts";
import { expectedIsolation, isolationContext, isolationWithFailure, liveFeeding, zonesConnected, type IsolationContext, type IsolationPlan } from "../operation/expectedIsolation.ts";
import { followingSources } from "../operation/sources.ts";
import { protectionZones } from "../operation/zones.ts";
import { elementNode, scenarioNetwork, type ScenarioNetwork } from "../scenarioNetwork.ts";
import { faultNode } from "../faultNode.ts";
import type { FaultLocation, FaultType, StudyOptions } from "../types.ts";

export interface LocationPlan {
  plan: IsolationPlan;
  /** One plan per expected edge, with that edge's breaker stuck (same order as plan.edges). */
  failures: IsolationPlan[];
  /** Buses of the faulted zone. */
  zoneBuses: string[];
  /** The zone the fault lies in (-1: a location outside the scenario's network). */
  faultZone: number;
  /** True when no energising source is connected to the fault, or only ones no device can separate. */
  isolatedAtStart: boolean;
  /** Grid-following converters connected to the fault: they cease to energise on their own protection. */
  selfCeasing: string[];
}

export interface ScenarioPlan {
  scenario: Scenario;
  net: ScenarioNetwork;
  isolation: IsolationContext;
  sides: Map<string, ProtectedSide>;
  locations: FaultLocation[];
  /** Graph node of each location (same order). */
  nodes: string[];
  /** Plans by location index, per fault type. */
  plans: Map<FaultType, LocationPlan[]>;
}

function zoneBusesOf(ctx: IsolationContext, plan: IsolationPlan): string[] {
  const out: string[] = [];
  for (const z of plan.zones) for (const n of ctx.zones.nodes[z]) if (n.startsWith("b:")) out.push(n.slice(2));
  return out;
}

export function planScenario(project: Project, scenario: Scenario, types: readonly FaultType[], options: StudyOptions): ScenarioPlan {
  const net = scenarioNetwork(project, scenario);
  const isolation = isolationContext(net, protectionZones(net));
  const locations = faultLocations(project, scenario, options);
  const nodes = locations.map(faultNode);
  const plans = new Map<FaultType, LocationPlan[]>();
  // The expected isolation depends on the zone a fault lies in, not on where in it: every location of a zone
  // shares one plan per fault type (a large network has tens of thousands of locations in a few hundred zones).
  const busesOfZones = new Map<string, string[]>();
  for (const type of types) {
    const byZone = new Map<number, LocationPlan>();
    plans.set(
      type,
      nodes.map((node) => {
        const faultZone = isolation.zones.zoneOf.get(node) ?? -1;
        let lp = byZone.get(faultZone);
        if (!lp) {
          const plan = expectedIsolation(isolation, node, type);
          const connected = faultZone >= 0 ? zonesConnected(isolation, faultZone) : new Set<number>();
          const zonesKey = plan.zones.join(",");
          let zoneBuses = busesOfZones.get(zonesKey);
          if (!zoneBuses) busesOfZones.set(zonesKey, (zoneBuses = zoneBusesOf(isolation, plan)));
          lp = {
            plan,
            failures: plan.edges.map((edge) => isolationWithFailure(isolation, plan, edge, type)),
            zoneBuses,
            faultZone,
            isolatedAtStart: faultZone < 0 || liveFeeding(isolation, faultZone, new Set()).every((s) => plan.outOfReach.includes(s)),
            selfCeasing: followingSources(net).filter((s) => connected.has(isolation.zones.zoneOf.get(elementNode(s)) ?? -1)),
          };
          byZone.set(faultZone, lp);
        }
        return lp;
      }),
    );
  }
  return { scenario, net, isolation, sides: deviceSides(net), locations, nodes, plans };
}
