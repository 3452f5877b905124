package org.fadebench.bench.report;

import com.fasterxml.jackson.databind.node.ObjectNode;
import org.fadebench.bench.link.FrameCounters;

/** How a point's counts are written in results.json and checkpoint.json: by {@link FrameCounters#byName()}. */
final class CountsJson {

    private CountsJson() {
    }

    /** Puts every count of {@code c} into {@code point} by its name: whole counts as integers. */
    static void put(ObjectNode point, FrameCounters c) {
        c.byName().forEach((name, n) -> {
            if (n instanceof Long whole) {
                point.put(name, whole);
            } else {
                point.put(name, n.doubleValue());
            }
        });
    }
}
