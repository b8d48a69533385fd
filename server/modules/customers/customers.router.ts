import { Router } from "express";
import type { AppDeps } from "../../deps";
import { actorOf, allow } from "../../http/guard";
import { body, params, query } from "../../http/validate";
import { idParamsSchema } from "../../../shared/schemas/common.schema";
import {
  createCustomerInputSchema,
  listCustomersQuerySchema,
  updateCustomerInputSchema,
} from "../../../shared/schemas/customer.schema";
import { createCustomer, deleteCustomer, getCustomer, listCustomers, updateCustomer } from "./customers.service";

export function customersRouter(deps: AppDeps) {
  const r = Router();
  r.get("/", allow("office"), (req, res) => {
    res.json(listCustomers(deps, query(req, listCustomersQuerySchema)));
  });
  r.post("/", allow("office"), (req, res) => {
    res.status(201).json(createCustomer(deps, body(req, createCustomerInputSchema)));
  });
  r.get("/:id", allow("office"), (req, res) => {
    res.json(getCustomer(deps, params(req, idParamsSchema).id));
  });
  r.patch("/:id", allow("office"), (req, res) => {
    res.json(updateCustomer(deps, actorOf(res).id, params(req, idParamsSchema).id, body(req, updateCustomerInputSchema)));
  });
  r.delete("/:id", allow("office"), (req, res) => {
    deleteCustomer(deps, params(req, idParamsSchema).id);
    res.status(204).end();
  });
  return r;
}
