package org.solmass.viewer;

/**
 * A message of the pipeline (written for the command line and the study file) in the window's
 * words: command-line flags and study keys in brackets are dropped, "set model.unit" reads "set the
 * model's unit", and the file:line of the set-up itself is left out.
 */
final class GuiWords {
    private GuiWords() {}

    static String of(String message) {
        if (message == null) return "";
        String s = message;
        s = s.replaceAll("\\s*\\((?:[a-z_.]+ )?--[a-z-]+[^)]*\\)", "");      // " (--unit)", " (model.unit --unit)"
        s = s.replaceAll("--[a-z][a-z-]*", "the setting");
        s = s.replace("model.unit", "the model's unit").replace("model.up", "the model's up axis")
                .replace("patch_m", "the patch size").replace("climate.source", "the climate");
        s = s.replaceFirst("^set-up: ", "");
        return s.isEmpty() ? s : Character.toUpperCase(s.charAt(0)) + s.substring(1);
    }
}
