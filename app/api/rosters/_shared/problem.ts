import "server-only";
import { ApiProblem } from "@/lib/api/problem";
import { RosterProblem } from "@/lib/rosters/problem";

/** Runs a roster use case; what it refuses becomes the API's error answer. */
export async function refusalsAsProblems<T>(work: () => Promise<T>): Promise<T> {
  try {
    return await work();
  } catch (error) {
    if (error instanceof RosterProblem) throw new ApiProblem(error.status, error.code, error.message, error.details);
    throw error;
  }
}
