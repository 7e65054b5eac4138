/** The caution line the planner and tolerance commands print. */
export const CLI_CAUTION = "Planning and training only: verify against makers' data, protection studies, local codes and licensed practice.";
