// Models slice: add, edit, remove and reorder model lines and bands (all through commit, so undoable).
import { newModel } from "../../project/defaults";
import type { ModelsSlice, SliceCreator } from "./types";
import { moveItem } from "./move";

export const createModelsSlice: SliceCreator<ModelsSlice> = (_set, get) => ({
  addModel(draft) {
    const model = newModel(draft, get().project);
    get().commit((p) => ({ ...p, models: [...p.models, model] }));
    return model.id;
  },
  updateModel(id, patch, opts) {
    get().commit((p) => {
      const i = p.models.findIndex((m) => m.id === id);
      if (i < 0) return p;
      const models = p.models.slice();
      models[i] = { ...models[i], ...patch, id };
      return { ...p, models };
    }, opts);
  },
  removeModel(id) {
    get().commit((p) =>
      p.models.some((m) => m.id === id) ? { ...p, models: p.models.filter((m) => m.id !== id) } : p,
    );
  },
  moveModel(id, delta) {
    get().commit((p) => {
      const models = moveItem(p.models, id, delta);
      return models === p.models ? p : { ...p, models };
    });
  },
});
