// What a roster use case refuses, with the HTTP status the API answers it with.
export class RosterProblem extends Error {
  constructor(
    readonly status: 404 | 409 | 422,
    readonly code: string,
    message: string,
    readonly details: Record<string, unknown> = {},
  ) {
    super(message);
    this.name = "RosterProblem";
  }
}
