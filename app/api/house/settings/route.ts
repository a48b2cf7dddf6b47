// GET /api/house/settings — the settings in force and their history; PUT keeps a new version (house only)
import { z } from "zod";
import { readJson, route } from "@/lib/api/route";
import { changeSettings, currentSettings, settingsHistory } from "@/lib/services/house-settings";
import { HouseSettingsChangeSchema } from "@/lib/validation/house-settings";

const PutSchema = HouseSettingsChangeSchema.extend({ baseVersion: z.number().int().positive().optional() });

export const GET = route({ permission: "house.manage" }, async () => ({
  ...(await currentSettings()),
  history: await settingsHistory(),
}));

export const PUT = route({ permission: "house.manage" }, async ({ req, viewer }) => ({
  version: await changeSettings(viewer, await readJson(req, PutSchema)),
}));
