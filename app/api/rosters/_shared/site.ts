import "server-only";
import { ApiProblem } from "@/lib/api/problem";
import { mainSite } from "@/app/(signed-in)/_queries/site";

/** The site rosters are built for (the app shows one site); 404 when none is set up. */
export async function rosterSite() {
  const site = await mainSite();
  if (!site) throw new ApiProblem(404, "no-site", "No site is set up yet; an administrator adds one (the demo seed does).");
  return site;
}
