import { useParams } from "react-router";

/** A record id read from a path parameter; `valid` is false for anything but a whole number above 0. */
export function idFrom(value: string | undefined): { id: number; valid: boolean } {
  const id = Number(value);
  return { id, valid: value !== undefined && Number.isInteger(id) && id > 0 };
}

/** The record id in the route's path: `/jobs/:jobId` → `useIdParam("jobId")`. */
export function useIdParam(name: string): { id: number; valid: boolean } {
  return idFrom(useParams()[name]);
}
