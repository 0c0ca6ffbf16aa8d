package org.twinlight.report;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.twinlight.fit.Estimate;
import org.twinlight.fit.FitResult;
import org.twinlight.fit.JointVelocities;
import org.twinlight.velocity.VelocityData;

/** The radial-velocity part of a joint light-curve + velocity fit in {@code fit.json} and the terminal summary. */
public final class JointFitFiles {

    private JointFitFiles() {
    }

    /**
     * Adds {@code "velocities"} to the fit.json document: K1, K2, γ and the offsets with their
     * uncertainties (the same entries as under "parameters"), the residual RMS of each star, the
     * files; and the velocity notes to {@code "notes"}. Without velocities of star 2 K2 is not a
     * result: it is left out of "parameters" and given as null here.
     */
    public static void putVelocities(ObjectNode root, FitResult r, JointVelocities v, List<Path> files) {
        ObjectNode node = root.putObject("velocities");
        for (Estimate e : r.parameters()) {
            boolean velocity = e.name().equals("k1") || e.name().equals("k2") || e.name().equals("gamma")
                    || e.name().startsWith("offset.");
            if (!velocity) {
                continue;
            }
            if (e.name().equals("k2") && !v.doubleLined()) {
                node.putNull("k2");
                ((ObjectNode) root.get("parameters")).remove("k2");
                continue;
            }
            ObjectNode q = node.putObject(e.name());
            q.put("value", e.value());
            q.put("uncertainty", e.uncertainty());
            q.put("unit", "km/s");
        }
        ObjectNode rms = node.putObject("residualRmsKms");
        rms.put("star1", v.rmsKms(r, 1));
        if (v.doubleLined()) {
            rms.put("star2", v.rmsKms(r, 2));
        } else {
            rms.putNull("star2");
        }
        ArrayNode list = node.putArray("files");
        for (int f = 0; f < files.size(); f++) {
            VelocityData d = v.files().get(f);
            ObjectNode o = list.addObject();
            o.put("file", files.get(f).toString());
            o.put("sha256", InputDigest.sha256(files.get(f)));
            o.put("timeScale", d.timeScale().label());
            o.put("star1", d.star1().size());
            o.put("star2", d.star2().size());
            ArrayNode inst = o.putArray("instruments");
            d.instruments().forEach(inst::add);
        }
        node.put("errorsEstimatedFromScatter", v.errorsEstimated());
        ArrayNode notes = (ArrayNode) root.get("notes");
        v.notes().forEach(notes::add);
        notes.add(VelocityFiles.CAUTION);
    }

    /**
     * The velocity plots of a joint fit, one per velocity file ({@code velocities.png}, then
     * {@code velocities-NAME.png}), each to {@code target.apply(name)}.
     *
     * @param lightCurve name of the light curve, for the titles
     * @return the names written, in order
     */
    public static List<String> writePlots(java.util.function.Function<String, Path> target, FitResult r,
            JointVelocities v, List<Path> files, String lightCurve) {
        List<String> names = new java.util.ArrayList<>();
        for (int f = 0; f < files.size(); f++) {
            String name = f == 0 ? "velocities.png" : "velocities-" + safeName(files.get(f)) + ".png";
            VelocityPlot.write(v.solution(r, f), v.files().get(f), target.apply(name), "Radial velocities of "
                    + files.get(f).getFileName() + ", joint fit with " + lightCurve);
            names.add(name);
        }
        return names;
    }

    /** A file's name without its extension, with every character but letters, digits, _ . - replaced by _. */
    private static String safeName(Path f) {
        String n = f.getFileName().toString();
        int dot = n.lastIndexOf('.');
        return (dot > 0 ? n.substring(0, dot) : n).replaceAll("[^A-Za-z0-9_.-]", "_");
    }

    /** The terminal lines of the velocity part (K1, K2, γ and the offsets are in the parameter table). */
    public static String summary(FitResult r, JointVelocities v) {
        StringBuilder sb = new StringBuilder();
        if (!v.doubleLined()) {
            sb.append("k2: not determined (no velocities of star 2; the value in the table is a placeholder)\n");
        }
        sb.append(String.format(Locale.ROOT, "velocity residual RMS: star 1 %.3f km/s", v.rmsKms(r, 1)));
        if (v.doubleLined()) {
            sb.append(String.format(Locale.ROOT, ", star 2 %.3f km/s", v.rmsKms(r, 2)));
        }
        return sb.append('\n').toString();
    }
}
