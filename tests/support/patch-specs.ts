import fc from "fast-check";
import { asc } from "drizzle-orm";
import type { z } from "zod";
import type { Shop } from "./test-app";
import { booths, guns, prepRecords, scheduleSessions, testPanels } from "../../server/db/schema";
import { updateBoothInputSchema, updateSessionInputSchema } from "../../shared/schemas/schedule.schema";
import { MONDAY_8 } from "./schedule-fixtures";
import { fx } from "./finish-fixtures";
import { addPanel, addPhoto } from "./booth-fixtures";
import { draftQuote } from "./quotes";
import { updateShopSettingsSchema } from "../../shared/schemas/settings.schema";
import { updateCustomerInputSchema } from "../../shared/schemas/customer.schema";
import { updateJobInputSchema } from "../../shared/schemas/job.schema";
import { updateJobItemInputSchema } from "../../shared/schemas/job-item.schema";
import { updateLotInputSchema, updateMaterialInputSchema } from "../../shared/schemas/material.schema";
import { updatePanelInputSchema } from "../../shared/schemas/panel.schema";
import { updatePrepRecordInputSchema } from "../../shared/schemas/prep.schema";
import { updateQuoteInputSchema } from "../../shared/schemas/quote.schema";
import { updateChangeOrderInputSchema } from "../../shared/schemas/change-order.schema";
import { updateGunInputSchema } from "../../shared/schemas/spray-setup.schema";
import { updateUploadInputSchema } from "../../shared/schemas/upload.schema";
import { updateUserInputSchema } from "../../shared/schemas/user.schema";
import { VOLUME_UNIT_IDS } from "../../shared/mix/index";
import { AREA_UNITS, SUBSTRATES } from "../../shared/domain/substrates";
import { LAYER_KINDS } from "../../shared/domain/layers";
import { MATERIAL_CATEGORIES, PURCHASE_UNITS } from "../../shared/domain/materials";
import { SCUFF_MEDIA } from "../../shared/domain/prep";
import { ILLUMINANTS, PANEL_LIGHTS } from "../../shared/domain/spray-setup";
import { TAXABLE_KINDS } from "../../shared/quote/totals";
import { TAXABLE_LINE_KINDS } from "../../shared/schemas/settings.schema";
import { FILM_UNITS, PRESSURE_UNITS, SCALE_UNITS, UNIT_SYSTEMS } from "../../shared/domain/measures";
import { TEMP_UNITS } from "../../shared/domain/booth";

/**
 * How to test one PATCH route for "a field left out stays as it was": how to read the record back, and for each
 * field (or fields that only go together, like a reading and its unit) an arbitrary change that the route must accept.
 * Values are generated already normalised (trimmed, in range), so what is read back equals what was sent.
 */
export type PatchSpec = {
  /** The update schema: every one of its fields must be covered by a change below. */
  schema: z.ZodObject;
  /** Extra setup after the matrix row's own `prepare`. */
  prepare?: (s: Shop) => unknown | Promise<unknown>;
  /** The PATCH address (defaults to the matrix row's). */
  path?: (s: Shop) => string;
  /** The GET that reads the record back, and where in its answer the record is. */
  read: (s: Shop) => string;
  pick?: (body: unknown, s: Shop) => unknown;
  changes: Record<string, (s: Shop) => fc.Arbitrary<Record<string, unknown>>>;
  /** Record paths a field's change legitimately moves as well (names looked up from an id, totals, labels). */
  follows?: Record<string, string[]>;
  /** Record paths every save moves (beside updatedAt and version), e.g. who last recorded the steps. */
  stamps?: string[];
  /** The name of the edit version in the record and the PATCH body, when it is not `version`. */
  versionKey?: string;
  /** How a sent value reads back when the answer shows it in another form. */
  readAs?: Record<string, (sent: unknown) => unknown>;
};

const word = fc.stringMatching(/^[A-Za-z0-9][A-Za-z0-9 ,.'-]{0,18}[A-Za-z0-9]$/).filter((s) => !/\s{2}/.test(s));
const optText = fc.option(word, { nil: null });
const one = <T>(key: string, arb: fc.Arbitrary<T>) => () => arb.map((v) => ({ [key]: v }));
const decimal = (min: number, max: number, places = 2) => fc.integer({ min: min * 10 ** places, max: max * 10 ** places }).map((n) => n / 10 ** places);
const date = (fromYear: number, toYear: number) =>
  fc.record({ y: fc.integer({ min: fromYear, max: toYear }), m: fc.integer({ min: 1, max: 12 }), d: fc.integer({ min: 1, max: 28 }) }).map(({ y, m, d }) => `${y}-${String(m).padStart(2, "0")}-${String(d).padStart(2, "0")}`);
const optDate = (from: number, to: number) => fc.option(date(from, to), { nil: null });
const bool = fc.boolean();
const ids = (s: Shop & Record<string, unknown>, key: string) => s[key] as number;

const panelIdOf = (s: Shop) => s.db.select({ id: testPanels.id }).from(testPanels).orderBy(asc(testPanels.id)).get()!.id;
const boothIdOf = (s: Shop) => s.db.select({ id: booths.id }).from(booths).orderBy(asc(booths.id)).get()!.id;
const sessionIdOf = (s: Shop) => s.db.select({ id: scheduleSessions.id }).from(scheduleSessions).orderBy(asc(scheduleSessions.id)).get()!.id;
const gunIdOf = (s: Shop) => s.db.select({ id: guns.id }).from(guns).orderBy(asc(guns.id)).get()!.id;

export const PATCH_SPECS: Record<string, PatchSpec> = {
  "PATCH /api/settings": {
    schema: updateShopSettingsSchema,
    read: () => "/api/settings",
    changes: {
      shopName: one("shopName", word),
      shopAddress: one("shopAddress", word),
      shopPhone: one("shopPhone", word),
      shopEmail: one("shopEmail", word),
      labourRateCents: one("labourRateCents", fc.integer({ min: 0, max: 100_000_000 })),
      taxPercent: one("taxPercent", decimal(0, 100)),
      taxAppliesTo: one("taxAppliesTo", fc.subarray([...TAXABLE_LINE_KINDS])),
      depositPercent: one("depositPercent", decimal(0, 100)),
      materialsMarkupPercent: one("materialsMarkupPercent", decimal(0, 500)),
      shopSuppliesPercent: one("shopSuppliesPercent", decimal(0, 100)),
      quoteValidDays: one("quoteValidDays", fc.integer({ min: 1, max: 365 })),
      quoteTerms: one("quoteTerms", word),
      defaultVolumeUnit: one("defaultVolumeUnit", fc.constantFrom(...VOLUME_UNIT_IDS)),
      defaultAreaUnit: one("defaultAreaUnit", fc.constantFrom(...AREA_UNITS)),
      // match ≤ close always holds with these ranges, whichever is changed alone.
      deltaEMatch: one("deltaEMatch", decimal(0.1, 1)),
      deltaEClose: one("deltaEClose", decimal(2, 50)),
      vocLimits: one(
        "vocLimits",
        fc.uniqueArray(fc.record({ layerKind: fc.constantFrom(...LAYER_KINDS), limitGPerL: fc.integer({ min: 1, max: 2000 }) }), { selector: (l) => l.layerKind, maxLength: 4 }),
      ),
      wasteAllowances: one(
        "wasteAllowances",
        fc.uniqueArray(fc.record({ layerKind: fc.constantFrom(...LAYER_KINDS), pct: decimal(0, 200) }), { selector: (l) => l.layerKind, maxLength: 4 }),
      ),
      minimumBatchMl: one("minimumBatchMl", decimal(0, 20_000)),
      vocMonthlyCapKg: one("vocMonthlyCapKg", fc.option(decimal(1, 1000), { nil: null })),
      vocYearlyCapKg: one("vocYearlyCapKg", fc.option(decimal(1, 10000), { nil: null })),
      lowDiskWarningGb: one("lowDiskWarningGb", decimal(0, 1000)),
      ratioTolerancePct: one("ratioTolerancePct", decimal(0.1, 20, 1)),
      unitSystem: one("unitSystem", fc.constantFrom(...UNIT_SYSTEMS)),
      filmUnit: one("filmUnit", fc.constantFrom(...FILM_UNITS)),
      pressureUnit: one("pressureUnit", fc.constantFrom(...PRESSURE_UNITS)),
      tempUnit: one("tempUnit", fc.constantFrom(...TEMP_UNITS)),
      massUnit: one("massUnit", fc.constantFrom(...SCALE_UNITS)),
      requireColourSignOff: one("requireColourSignOff", bool),
    },
  },
  "PATCH /api/customers/:id": {
    schema: updateCustomerInputSchema,
    read: (s) => `/api/customers/${s.customerA.id}`,
    changes: {
      name: one("name", word),
      email: one("email", fc.option(fc.stringMatching(/^[a-z][a-z0-9]{0,10}@[a-z]{2,10}\.test$/), { nil: null })),
      phone: one("phone", optText),
      address: one("address", optText),
      notes: one("notes", optText),
    },
  },
  "PATCH /api/jobs/:id": {
    schema: updateJobInputSchema,
    read: (s) => `/api/jobs/${s.jobA.id}`,
    changes: {
      customerId: (s) => one("customerId", fc.constantFrom(s.customerA.id, s.customerB.id, s.spareCustomer.id))(),
      title: one("title", word),
      dueDate: one("dueDate", optDate(2026, 2030)),
      assignedPainterId: (s) => one("assignedPainterId", fc.constantFrom(s.painter.id, s.painter2.id, null))(),
      notes: one("notes", optText),
    },
    follows: { customerId: ["customerName", "customerEmail", "customerPhone"], assignedPainterId: ["assignedPainterName"] },
  },
  "PATCH /api/jobs/:id/items/:itemId": {
    schema: updateJobItemInputSchema,
    read: (s) => `/api/jobs/${s.jobA.id}/items/${s.itemA.id}`,
    changes: {
      name: one("name", word),
      substrate: one("substrate", fc.constantFrom(...SUBSTRATES)),
      surfaceArea: one("surfaceArea", decimal(0.01, 1000)),
      areaUnit: one("areaUnit", fc.constantFrom(...AREA_UNITS)),
      notes: one("notes", optText),
    },
    follows: { substrate: ["needsAdhesionPromoter", "substrateLabel"], surfaceArea: ["areaM2"], areaUnit: ["areaM2"] },
  },
  "PATCH /api/materials/:id": {
    schema: updateMaterialInputSchema,
    read: (s) => `/api/materials/${fx(s).clear.id}`,
    changes: {
      code: one("code", fc.stringMatching(/^ZQ-[A-Z0-9]{1,8}$/)),
      name: one("name", word),
      category: one("category", fc.constantFrom(...MATERIAL_CATEGORIES)),
      purchaseUnit: one("purchaseUnit", fc.constantFrom(...PURCHASE_UNITS)),
      costCents: one("costCents", fc.integer({ min: 0, max: 10_000_000 })),
      volumeSolidsPct: one("volumeSolidsPct", fc.option(decimal(0, 100), { nil: null })),
      vocGPerL: one("vocGPerL", fc.option(fc.integer({ min: 0, max: 2000 }), { nil: null })),
      // An empty water-and-exempt share is stored as 0 (see updateMaterial), so only figures are sent.
      waterExemptPct: one("waterExemptPct", decimal(0, 100)),
      densityGPerMl: one("densityGPerMl", fc.option(decimal(0.01, 5), { nil: null })),
      potLifeMinutes: one("potLifeMinutes", fc.option(fc.integer({ min: 1, max: 10_080 }), { nil: null })),
      containsIsocyanates: one("containsIsocyanates", bool),
      flammable: one("flammable", bool),
      lowStockThreshold: one("lowStockThreshold", fc.option(decimal(0, 1000), { nil: null })),
      notes: one("notes", optText),
      active: one("active", bool),
      // Minimum recoat under an hour and maximum from two hours, so each changed alone keeps min ≤ max.
      inductionMinutes: one("inductionMinutes", fc.option(fc.integer({ min: 1, max: 120 }), { nil: null })),
      recoatMinMinutes: one("recoatMinMinutes", fc.option(fc.integer({ min: 0, max: 60 }), { nil: null })),
      recoatMaxMinutes: one("recoatMaxMinutes", fc.option(fc.integer({ min: 120, max: 10_080 }), { nil: null })),
    },
    follows: {
      category: ["categoryLabel", "cautions", "hazardous", "usage"],
      containsIsocyanates: ["cautions", "hazardous"],
      flammable: ["cautions", "hazardous"],
      vocGPerL: ["voc", "vocLbPerGal", "regulatoryVoc"],
      waterExemptPct: ["voc", "vocLbPerGal", "regulatoryVoc"],
      densityGPerMl: ["voc"],
      lowStockThreshold: ["lowStock"],
      purchaseUnit: ["onHandLabel", "lowStock"],
    },
  },
  "PATCH /api/materials/:id/lots/:lotId": {
    schema: updateLotInputSchema,
    read: (s) => `/api/materials/${fx(s).clear.id}/lots`,
    pick: (body, s) => (body as { id: number }[]).find((l) => l.id === fx(s).clearLot.id) ?? (body as { items: { id: number }[] }).items?.find((l) => l.id === fx(s).clearLot.id),
    changes: {
      lotNumber: one("lotNumber", fc.stringMatching(/^ZQ-[A-Z0-9]{1,8}$/)),
      quantityOnHand: one("quantityOnHand", decimal(0, 1000)),
      // received before expiry whichever is changed alone.
      receivedOn: one("receivedOn", optDate(2020, 2024)),
      expiresOn: one("expiresOn", optDate(2027, 2030)),
    },
    follows: { expiresOn: ["expired", "expiresSoon", "status"] },
  },
  "PATCH /api/panels/:id": {
    schema: updatePanelInputSchema,
    prepare: (s) => {
      s.db.insert(guns).values([{ name: "Gun A" }, { name: "Gun B" }]).run();
      addPanel(s, { coats: 3, jobId: s.jobA.id, createdBy: s.painter.id, labL: 30, labA: 45, labB: 18 });
    },
    path: (s) => `/api/panels/${panelIdOf(s)}`,
    read: (s) => `/api/panels/${panelIdOf(s)}`,
    changes: {
      groundName: one("groundName", word),
      groundMaterialId: (s) => one("groundMaterialId", fc.constantFrom(null, fx(s).clear.id))(),
      candyName: one("candyName", word),
      candyMaterialId: (s) => one("candyMaterialId", fc.constantFrom(null, fx(s).clear.id))(),
      letDownClear: one("letDownClear", decimal(0.5, 100, 1)),
      letDownToner: one("letDownToner", decimal(0.5, 100, 1)),
      coats: one("coats", fc.integer({ min: 1, max: 30 })),
      jobId: (s) => one("jobId", fc.constantFrom(null, s.jobA.id, s.jobB.id))(),
      planLayerId: one("planLayerId", fc.constant(null)),
      mixSheetId: one("mixSheetId", fc.constant(null)),
      lab: () => fc.option(fc.record({ labL: decimal(0, 100), labA: decimal(-160, 160), labB: decimal(-160, 160) }), { nil: null }).map((l) => l ?? { labL: null, labA: null, labB: null }),
      sprayedOn: one("sprayedOn", optDate(2024, 2026)),
      notes: one("notes", optText),
      readings: one(
        "readings",
        fc.uniqueArray(
          fc.record({ light: fc.constantFrom(...PANEL_LIGHTS), illuminant: fc.constantFrom(...ILLUMINANTS), labL: decimal(0, 100), labA: decimal(-160, 160), labB: decimal(-160, 160) }),
          { selector: (r) => r.light, maxLength: 3 },
        ),
      ),
      gunId: (s) => one("gunId", fc.constantFrom(null, gunIdOf(s), gunIdOf(s) + 1))(),
      tipMm: one("tipMm", fc.option(decimal(0.2, 4, 1), { nil: null })),
      pressure: () => fc.oneof(fc.record({ inletPressure: decimal(1, 100, 0), pressureUnit: fc.constant("psi") }), fc.record({ inletPressure: decimal(0.1, 7, 1), pressureUnit: fc.constant("bar") })),
      lengths: () =>
        fc.oneof(
          fc.record({ distance: decimal(3, 60, 0), fanWidth: decimal(2, 60, 0), distanceUnit: fc.constant("cm") }),
          fc.record({ distance: decimal(1, 24, 0), fanWidth: decimal(1, 24, 0), distanceUnit: fc.constant("in") }),
        ),
      overlapPct: one("overlapPct", fc.option(fc.integer({ min: 0, max: 100 }), { nil: null })),
      temperature: () => fc.oneof(fc.record({ boothTemp: fc.integer({ min: 15, max: 35 }), tempUnit: fc.constant("C") }), fc.record({ boothTemp: fc.integer({ min: 60, max: 95 }), tempUnit: fc.constant("F") })),
      humidityPct: one("humidityPct", fc.option(fc.integer({ min: 0, max: 100 }), { nil: null })),
    },
    readAs: {
      readings: (sent) =>
        (sent as { light: string; illuminant: string; labL: number; labA: number; labB: number }[]).map((r) => ({ light: r.light, illuminant: r.illuminant, lab: { L: r.labL, a: r.labA, b: r.labB } })),
    },
    follows: {
      groundName: ["label"],
      groundMaterialId: ["groundName", "label"],
      candyName: ["label"],
      letDownClear: ["label", "tonerFraction"],
      letDownToner: ["label", "tonerFraction"],
      coats: ["label"],
      jobId: ["jobTitle", "isApprovedForJob", "vsApproved", "photo.jobId"],
      labL: ["lab"],
      labA: ["lab"],
      labB: ["lab"],
      gunId: ["setup.gunName", "setup.summary"],
      tipMm: ["setup.summary"],
      inletPressure: ["setup.summary"],
      pressureUnit: ["setup.summary"],
      distance: ["setup.summary"],
      fanWidth: ["setup.summary"],
      distanceUnit: ["setup.summary"],
      overlapPct: ["setup.summary"],
    },
  },
  "PATCH /api/prep-records/:id": {
    schema: updatePrepRecordInputSchema,
    read: (s) => `/api/prep-records/${s.db.select({ id: prepRecords.id }).from(prepRecords).get()!.id}`,
    changes: {
      scuffMedium: one("scuffMedium", fc.option(fc.constantFrom(...SCUFF_MEDIA), { nil: null })),
      scuffGrit: one("scuffGrit", fc.option(fc.integer({ min: 36, max: 5000 }), { nil: null })),
      cleaner: one("cleaner", optText),
      tackCloth: one("tackCloth", bool),
      adhesionPromoter: one("adhesionPromoter", bool),
      adhesionPromoterProduct: one("adhesionPromoterProduct", optText),
      notes: one("notes", optText),
    },
    stamps: ["preparedByName", "preparedAt"],
    follows: Object.fromEntries(["scuffMedium", "scuffGrit", "cleaner", "tackCloth", "adhesionPromoter", "adhesionPromoterProduct"].map((k) => [k, ["missingSteps", "status"]])),
  },
  "PATCH /api/quotes/:id": {
    schema: updateQuoteInputSchema,
    prepare: (s) => draftQuote(s).then(() => undefined),
    read: () => "/api/quotes/1",
    // The draft's fields are under `current`; lifted up so what was sent can be read back.
    pick: (body) => {
      const { current, ...rest } = body as { current: Record<string, unknown> };
      return { ...rest, ...current };
    },
    // `version` is the quote's own version number; the edit version is `editVersion`.
    versionKey: "editVersion",
    changes: {
      lines: one(
        "lines",
        fc.array(
          fc.oneof(
            fc.record({ kind: fc.constant("labour"), description: word, hours: decimal(0.25, 100), rateCents: fc.integer({ min: 0, max: 100_000 }) }),
            fc.record({ kind: fc.constant("materials"), description: word, costCents: fc.integer({ min: 0, max: 1_000_000 }), markupPercent: decimal(0, 100) }),
            fc.record({ kind: fc.constant("sublet"), description: word, amountCents: fc.integer({ min: 0, max: 1_000_000 }) }),
          ),
          { minLength: 1, maxLength: 4 },
        ),
      ),
      validUntil: one("validUntil", date(2027, 2030)),
      intro: one("intro", optText),
      terms: one("terms", optText),
      finishText: one("finishText", optText),
      taxPercent: one("taxPercent", decimal(0, 20)),
      taxedKinds: one("taxedKinds", fc.subarray([...TAXABLE_KINDS])),
      taxRounding: one("taxRounding", fc.constantFrom("invoice", "line")),
      depositPercent: one("depositPercent", decimal(0, 100)),
    },
    // Every figure of the quote follows from its lines, tax and deposit.
    follows: Object.fromEntries(["lines", "taxPercent", "taxedKinds", "taxRounding", "depositPercent"].map((k) => [k, ["totals", "versions", "totalCents", "depositCents"]])),
  },
  "PATCH /api/change-orders/:id": {
    schema: updateChangeOrderInputSchema,
    read: () => "/api/change-orders/1",
    // The price lines are under `money`; lifted up so what was sent can be read back.
    pick: (body) => ({ ...(body as object), lines: (body as { money: { lines: unknown } }).money.lines }),
    changes: {
      summary: one("summary", word),
      colourChanged: one("colourChanged", bool),
      lines: one(
        "lines",
        fc.array(
          fc.oneof(
            fc.record({ kind: fc.constant("labour"), description: word, hours: decimal(0.25, 100), rateCents: fc.integer({ min: 0, max: 100_000 }) }),
            fc.record({ kind: fc.constant("sublet"), description: word, amountCents: fc.integer({ min: 0, max: 1_000_000 }) }),
          ),
          { minLength: 0, maxLength: 3 },
        ),
      ),
    },
    // The money follows from the lines.
    follows: { lines: ["money"] },
  },
  "PATCH /api/guns/:id": {
    schema: updateGunInputSchema,
    path: (s) => `/api/guns/${gunIdOf(s)}`,
    read: () => "/api/guns?includeInactive=true",
    pick: (body, s) => {
      const list = Array.isArray(body) ? body : (body as { items: { id: number }[] }).items;
      return (list as { id: number }[]).find((g) => g.id === gunIdOf(s));
    },
    changes: { name: one("name", word), description: one("description", optText), active: one("active", bool) },
  },
  "PATCH /api/booths/:id": {
    schema: updateBoothInputSchema,
    path: (s) => `/api/booths/${boothIdOf(s)}`,
    read: () => "/api/booths",
    pick: (body, s) => (body as { id: number }[]).find((b) => b.id === boothIdOf(s)),
    changes: {
      name: one("name", word),
      setupMinutes: one("setupMinutes", fc.integer({ min: 0, max: 480 })),
      canCureOutside: one("canCureOutside", bool),
      // Opening stays before closing whichever one changes alone.
      opensAt: one("opensAt", fc.constantFrom("05:00", "06:30", "07:00", "08:15", "09:45")),
      closesAt: one("closesAt", fc.constantFrom("15:00", "16:30", "17:00", "18:45", "22:00")),
      workDays: one("workDays", fc.uniqueArray(fc.integer({ min: 0, max: 6 }), { minLength: 1, maxLength: 7 }).map((d) => [...d].sort())),
      timeZone: one("timeZone", fc.constantFrom("UTC", "America/Chicago", "Europe/Berlin", "Australia/Sydney")),
      active: one("active", bool),
    },
  },
  "PATCH /api/schedule/sessions/:id": {
    schema: updateSessionInputSchema,
    path: (s) => `/api/schedule/sessions/${sessionIdOf(s)}`,
    read: () => `/api/schedule?from=${new Date(MONDAY_8 - 86_400_000).toISOString()}&to=${new Date(MONDAY_8 + 7 * 86_400_000).toISOString()}`,
    pick: (body, s) => (body as { sessions: { id: number }[] }).sessions.find((x) => x.id === sessionIdOf(s)),
    changes: {
      boothId: (s) => fc.constantFrom(...s.db.select({ id: booths.id }).from(booths).all().map((b) => b.id)).map((boothId) => ({ boothId })),
      startsAt: one("startsAt", fc.integer({ min: 0, max: 4 * 24 * 4 }).map((q) => new Date(MONDAY_8 + q * 15 * 60_000).toISOString())),
    },
    // A session's end and last coat follow from its start and its booth.
    follows: { boothId: ["endsAt", "sprayEndsAt"], startsAt: ["endsAt", "sprayEndsAt"] },
  },
  "PATCH /api/uploads/:id": {
    schema: updateUploadInputSchema,
    // A panel photo of job A: every field (caption, shareable, light) applies to it.
    prepare: async (s) => {
      const panel = addPanel(s, { jobId: s.jobA.id, createdBy: s.painter.id });
      (s as Shop & { photoId?: number }).photoId = (await addPhoto(s, { ownerType: "panel", ownerId: panel.id, jobId: s.jobA.id }, { by: s.painter.id })).id;
    },
    path: (s) => `/api/uploads/${ids(s as Shop & Record<string, unknown>, "photoId")}`,
    read: (s) => `/api/uploads?jobId=${s.jobA.id}`,
    pick: (body, s) => (body as { id: number }[]).find((u) => u.id === ids(s as Shop & Record<string, unknown>, "photoId")),
    changes: { shareable: one("shareable", bool), caption: one("caption", optText), light: one("light", fc.option(fc.constantFrom(...PANEL_LIGHTS), { nil: null })) },
  },
  "PATCH /api/users/:id": {
    schema: updateUserInputSchema,
    read: (s) => `/api/users/${s.painter.id}`,
    changes: {
      name: one("name", word),
      active: one("active", bool),
      role: () => fc.constantFrom("owner", "estimator", "painter").map((role) => ({ role, customerId: null })),
      customer: (s) => fc.constantFrom(s.customerA.id, s.customerB.id).map((customerId) => ({ role: "customer", customerId })),
    },
    follows: { customerId: ["customerName"] },
  },
};
