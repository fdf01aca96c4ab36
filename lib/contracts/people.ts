// People and API tokens: the shapes the admin and account routes answer with, and their URLs.
// Neither server-only nor React.
import type { User } from "@/db/schema";

export interface UserDto {
  id: string;
  email: string;
  name: string;
  role: User["role"];
  disabled: boolean;
  invited: boolean;
  unitSystem: User["unitSystem"];
  locale: User["locale"];
  createdAt: string;
}

export interface ApiTokenDto {
  id: string;
  name: string;
  prefix: string;
  createdAt: string;
  lastUsedAt: string | null;
}

/** An API token as administrators see it: with its owner. */
export interface OwnedApiTokenDto extends ApiTokenDto {
  owner: { id: string; name: string; email: string; disabled: boolean };
}

export const peopleUrls = {
  users: () => "/api/v1/users",
  user: (id: string) => `/api/v1/users/${encodeURIComponent(id)}`,
  invitation: (id: string) => `/api/v1/users/${encodeURIComponent(id)}/invitation`,
  resetLink: (id: string) => `/api/v1/users/${encodeURIComponent(id)}/reset-link`,
  tokens: () => "/api/v1/tokens",
  token: (id: string) => `/api/v1/tokens/${encodeURIComponent(id)}`,
  allTokens: () => "/api/v1/admin/tokens",
  anyToken: (id: string) => `/api/v1/admin/tokens/${encodeURIComponent(id)}`,
  me: () => "/api/v1/me",
};
