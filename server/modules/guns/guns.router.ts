import { Router } from "express";
import type { AppDeps } from "../../deps";
import { actorOf, allow } from "../../http/guard";
import { body, params } from "../../http/validate";
import { idParamsSchema } from "../../../shared/schemas/common.schema";
import { gunInputSchema, updateGunInputSchema } from "../../../shared/schemas/spray-setup.schema";
import { createGun, listGuns, updateGun } from "./guns.service";

/** The shop's gun list: every staff member picks from it; the office keeps it. */
export function gunsRouter(deps: AppDeps) {
  const r = Router();
  r.get("/", allow("staff"), (_req, res) => {
    res.json(listGuns(deps));
  });
  r.post("/", allow("office"), (req, res) => {
    res.status(201).json(createGun(deps, body(req, gunInputSchema)));
  });
  r.patch("/:id", allow("office"), (req, res) => {
    res.json(updateGun(deps, actorOf(res).id, params(req, idParamsSchema).id, body(req, updateGunInputSchema)));
  });
  return r;
}
