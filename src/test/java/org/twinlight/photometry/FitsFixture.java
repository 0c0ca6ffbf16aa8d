package org.twinlight.photometry;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import nom.tam.fits.BasicHDU;
import nom.tam.fits.BinaryTable;
import nom.tam.fits.BinaryTableHDU;
import nom.tam.fits.Fits;
import nom.tam.fits.Header;
import nom.tam.fits.ImageHDU;

/** Writes small FITS files for tests with nom-tam-fits: an empty primary HDU, then the tables. */
public final class FitsFixture {

    /** One binary table: named columns (arrays of one primitive type each) and header keywords. */
    public static final class Table {
        final Map<String, Object> columns = new LinkedHashMap<>();
        final Map<String, Object> keywords = new LinkedHashMap<>();

        public Table column(String name, Object array) {
            columns.put(name, array);
            return this;
        }

        public Table key(String key, Object value) {
            keywords.put(key, value);
            return this;
        }
    }

    private final List<Object> hdus = new ArrayList<>();

    public FitsFixture table(Table t) {
        hdus.add(t);
        return this;
    }

    public FitsFixture image(float[][] data) {
        hdus.add(data);
        return this;
    }

    public void write(Path file) throws IOException {
        try (Fits fits = new Fits()) {
            fits.addHDU(BasicHDU.getDummyHDU());
            for (Object h : hdus) {
                if (h instanceof Table t) {
                    BinaryTable bt = BinaryTable.fromColumnMajor(t.columns.values().toArray());
                    BinaryTableHDU hdu = (BinaryTableHDU) Fits.makeHDU(bt);
                    int c = 0;
                    for (String name : t.columns.keySet()) {
                        hdu.setColumnName(c++, name, null);
                    }
                    Header header = hdu.getHeader();
                    for (Map.Entry<String, Object> e : t.keywords.entrySet()) {
                        if (e.getValue() instanceof Number n) {
                            header.addValue(e.getKey(), n, null);
                        } else {
                            header.addValue(e.getKey(), String.valueOf(e.getValue()), null);
                        }
                    }
                    fits.addHDU(hdu);
                } else {
                    fits.addHDU((ImageHDU) Fits.makeHDU(h));
                }
            }
            fits.write(file.toFile());
        }
    }
}
