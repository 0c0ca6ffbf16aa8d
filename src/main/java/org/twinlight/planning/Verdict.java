package org.twinlight.planning;

/** Whether an eclipse can be observed from the site within the limits. */
public enum Verdict {
    /** From first to last contact the target is high enough and the sky dark enough. */
    WHOLE("whole"),
    /** The minimum and at least one whole branch (ingress or egress) are. */
    PARTIAL("partial"),
    /** Not even the minimum with one branch. */
    NOT_OBSERVABLE("not-observable");

    private final String label;

    Verdict(String label) {
        this.label = label;
    }

    /** The label used in files. */
    public String label() {
        return label;
    }

    /** True for whole and partial. */
    public boolean observable() {
        return this != NOT_OBSERVABLE;
    }
}
