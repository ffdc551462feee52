// A new order must list exactly the items it reorders: none missing, none extra, none twice.
import { ApiProblem } from "@/lib/api/problem";

export function checkSameIds(what: string, current: number[], given: number[]): void {
  const have = new Set(current);
  const seen = new Set<number>();
  for (const id of given) {
    if (!have.has(id)) throw new ApiProblem(422, "invalid-order", `The new order names ${id}, which is not one of these ${what}; reload the page and try again.`, { field: "ids" });
    if (seen.has(id)) throw new ApiProblem(422, "invalid-order", `The new order names ${id} twice; list each of the ${what} once.`, { field: "ids" });
    seen.add(id);
  }
  if (seen.size !== have.size) {
    throw new ApiProblem(422, "invalid-order", `The new order leaves out ${have.size - seen.size} of the ${what}; reload the page and try again.`, { field: "ids" });
  }
}
