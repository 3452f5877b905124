package org.fadebench.bench.study;

import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.fadebench.bench.report.AtomicFiles;

/**
 * Everything a study (or {@code compare}) writes into its own folder, beside the designs'
 * sub-folders: study.csv and study.json, from one {@link StudyTable}. Each file is written under a
 * temporary name and renamed.
 */
public final class StudyOutputs {

    public static final String CSV = "study.csv";
    public static final String JSON = "study.json";

    private static final ObjectMapper MAPPER = new ObjectMapper();

    private StudyOutputs() {
    }

    /** Writes the study's files into {@code dir}; returns the files written. */
    public static List<Path> write(Path dir, StudyTable table) throws IOException {
        List<Path> written = new ArrayList<>();
        Path csv = dir.resolve(CSV);
        AtomicFiles.writeString(csv, table.csv());
        written.add(csv);
        Path json = dir.resolve(JSON);
        byte[] bytes = MAPPER.writerWithDefaultPrettyPrinter().writeValueAsBytes(table.json());
        AtomicFiles.write(json, out -> {
            out.write(bytes);
            out.write('\n');
        });
        written.add(json);
        // The one place for the study's figure and report: fer.png/fer.svg (every design's FER with its
        // interval from table.rows().get(i).curve(), the target FER and table.budgetDb() as lines, the
        // QAM-constrained bound curve().qamOutage() dashed when asked, SNR or Eb/N0 on the x axis) and
        // report.html (the ranking of table.json(), the figure's SVG, each design's settings and summary
        // from its folder table.rows().get(i).folder()) are to be written here.
        return written;
    }
}
