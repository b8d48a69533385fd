import { Router } from "express";
import type { AppDeps } from "../../deps";
import { allow } from "../../http/guard";
import { body } from "../../http/validate";
import { computeMix } from "../../../shared/mix/index";
import { mixRequestSchema } from "../../../shared/schemas/mix.schema";

/** The mix engine over HTTP, for clients without the bundle. MixErrors become 400s naming the component. */
export function mixRouter(_deps: AppDeps) {
  const r = Router();
  r.post("/compute", allow("staff"), (req, res) => {
    res.json(computeMix(body(req, mixRequestSchema)));
  });
  return r;
}
