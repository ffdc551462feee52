// The refusal a delete gets while rooms are still in use: it names each room and what holds it,
// and says how to go ahead anyway (confirm), so nothing disappears from a plan unannounced.
import { ApiProblem } from "@/lib/api/problem";

export interface RoomInUse {
  id: number;
  name: string;
  exhibitions: string[];
  approvedPlans: number;
}

function holds(room: RoomInUse): string {
  const parts: string[] = [];
  if (room.exhibitions.length > 0) parts.push(`is in ${room.exhibitions.join(", ")}`);
  if (room.approvedPlans > 0) parts.push(`has ${room.approvedPlans === 1 ? "an approved post plan" : `${room.approvedPlans} approved post plans`}`);
  return `${room.name} ${parts.join(" and ")}`;
}

/** 409 naming the rooms in use; `what` is e.g. "this room" or "floor Ground floor". */
export function inUseProblem(what: string, rooms: RoomInUse[]): ApiProblem {
  const list = rooms.slice(0, 5).map(holds).join("; ");
  const more = rooms.length > 5 ? `; and ${rooms.length - 5} more rooms` : "";
  return new ApiProblem(
    409,
    "in-use",
    `Not deleted: ${list}${more}. Deleting ${what} also deletes ${rooms.length === 1 ? "its place" : "their places"} in exhibitions and the approved posts staffing counts on. Take the room out of the exhibition first, or confirm the delete.`,
    { rooms },
  );
}
