// The scheduling domain's public face for the app, the jobs and the command line.
export { parseScenario, scenarioSchema, rulesSchema, type Scenario, type Rules, type Guard, type Post, type ScenarioError } from "./scenario";
export { buildDemand, type Demand } from "./demand";
export { buildRoster, type RosterResult } from "./engine";
export { checkRoster, ruleChecks, ruleContext, type RuleContext } from "./rules";
export { repairRoster, type RosterChange, type RepairResult, type AffectedGuard } from "./repair";
export { computeTotals, lowerBound, type Totals } from "./totals";
export { rosterToJson, resultToJson, violationsToJson } from "./output";
export type { Roster, Shift, Segment, ShiftBreak, UnfilledSlot, Violation } from "./roster";
export { parseLocal, formatLocal } from "./time";
