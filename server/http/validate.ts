import type { Request } from "express";
import { z } from "zod";
import { badRequest } from "./http-error";

/** Turns zod issues into `{ "field.path": "message" }`, first message per field. */
export function zodFields(error: z.ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join(".") : "_";
    fields[key] ??= issue.message;
  }
  return fields;
}

function parse<S extends z.ZodType>(schema: S, value: unknown, where: string): z.output<S> {
  const result = schema.safeParse(value);
  if (result.success) return result.data;
  const fields = zodFields(result.error);
  const first = Object.entries(fields)[0];
  throw badRequest(first ? `Check the ${where}: ${first[0] === "_" ? "" : `${first[0]}: `}${first[1]}` : `Invalid ${where}`, fields);
}

/** Parse the JSON body with a shared schema; throws a 400 naming each bad field. */
export const body = <S extends z.ZodType>(req: Request, schema: S) => parse(schema, req.body ?? {}, "request body");
export const query = <S extends z.ZodType>(req: Request, schema: S) => parse(schema, req.query ?? {}, "query");
export const params = <S extends z.ZodType>(req: Request, schema: S) => parse(schema, req.params ?? {}, "address");
