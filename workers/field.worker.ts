/**
 * Field worker entry: exposes the field API (SEG-2 reader, first-break pickers, comparison with
 * the candidate models, modelled curves and times, suggested segments, interpretation) through
 * comlink.
 * The samples of a read record are transferred, not copied.
 */
import "./zod-jitless";
import { expose, transfer } from "comlink";
import { fieldApi, type FieldApi } from "./field/worker-api";

const api: FieldApi = {
  ...fieldApi,
  readSeg2(input) {
    const record = fieldApi.readSeg2(input);
    return transfer(
      record,
      record.traces.map((t) => t.samples.buffer as ArrayBuffer),
    );
  },
};

expose(api);
