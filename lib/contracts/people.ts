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
  createdAt: string;
}

export interface ApiTokenDto {
  id: string;
  name: string;
  prefix: string;
  createdAt: string;
  lastUsedAt: string | null;
}

export const peopleUrls = {
  users: () => "/api/v1/users",
  user: (id: string) => `/api/v1/users/${encodeURIComponent(id)}`,
  invitation: (id: string) => `/api/v1/users/${encodeURIComponent(id)}/invitation`,
  resetLink: (id: string) => `/api/v1/users/${encodeURIComponent(id)}/reset-link`,
  tokens: () => "/api/v1/tokens",
  token: (id: string) => `/api/v1/tokens/${encodeURIComponent(id)}`,
  me: () => "/api/v1/me",
};
