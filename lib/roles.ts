export const ROLES = ["owner", "presenter", "editor", "producer", "sponsor_liaison"] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  owner: "Owner",
  presenter: "Presenter",
  editor: "Editor",
  producer: "Producer",
  sponsor_liaison: "Sponsor liaison",
};
