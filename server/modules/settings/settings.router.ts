import { Router } from "express";
import type { AppDeps } from "../../deps";
import { allow } from "../../http/guard";
import { body } from "../../http/validate";
import { ctxOf } from "../../http/context";
import { updateShopSettingsSchema } from "../../../shared/schemas/settings.schema";
import { getEditableSettings, getPublicSettings, updateSettings } from "./settings.service";

export function settingsRouter(deps: AppDeps) {
  const r = Router();
  /** Names, units and colour thresholds, for every signed-in user (no money). */
  r.get("/shop", allow("signedIn"), (_req, res) => {
    res.json(getPublicSettings(deps));
  });
  r.get("/", allow("office"), (_req, res) => {
    res.json(getEditableSettings(deps));
  });
  r.patch("/", allow("owner"), (req, res) => {
    res.json(updateSettings(deps, ctxOf(req, res), body(req, updateShopSettingsSchema)));
  });
  return r;
}
