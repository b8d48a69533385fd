import { Router } from "express";
import { z } from "zod";
import type { AppDeps } from "../../deps";
import { allow } from "../../http/guard";
import { ctxOf } from "../../http/context";
import { body, params, query } from "../../http/validate";
import { createUserInputSchema, listUsersQuerySchema, updateUserInputSchema } from "../../../shared/schemas/user.schema";
import { createUser, getUser, listPainters, listUsers, updateUser } from "./users.service";

const userParams = z.object({ id: z.string().min(1).max(64) });

export function usersRouter(deps: AppDeps) {
  const r = Router();
  r.get("/", allow("owner"), (req, res) => {
    res.json(listUsers(deps, query(req, listUsersQuerySchema)));
  });
  r.post("/", allow("owner"), async (req, res) => {
    res.status(201).json(await createUser(deps, ctxOf(req, res), body(req, createUserInputSchema)));
  });
  r.get("/:id", allow("owner"), (req, res) => {
    res.json(getUser(deps, params(req, userParams).id));
  });
  r.patch("/:id", allow("owner"), async (req, res) => {
    res.json(await updateUser(deps, ctxOf(req, res), params(req, userParams).id, body(req, updateUserInputSchema)));
  });
  return r;
}

/** Painters to assign jobs to; the office needs this without seeing the users admin. */
export function paintersRouter(deps: AppDeps) {
  const r = Router();
  r.get("/", allow("office"), (_req, res) => {
    res.json(listPainters(deps));
  });
  return r;
}
