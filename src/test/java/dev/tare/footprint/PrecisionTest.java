package dev.tare.footprint;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.TareException;
import org.junit.jupiter.api.Test;

/** Precision names and their bits: IEEE 754 binary32/binary16 widths, bfloat16, 8- and 4-bit formats. */
class PrecisionTest {
    @Test
    void namesMapToTheirWidths() {
        // IEEE 754-2008: binary32 is 32 bits, binary16 16; bfloat16 is 16 bits by definition.
        assertEquals(32, Precision.parse("fp32"));
        assertEquals(16, Precision.parse("FP16"));
        assertEquals(16, Precision.parse("bf16"));
        // 8-bit floating point and integer formats, and 4-bit integers (common practice, no source).
        assertEquals(8, Precision.parse("fp8"));
        assertEquals(8, Precision.parse("int8"));
        assertEquals(4, Precision.parse("int4"));
    }

    @Test
    void numbersIncludeEffectiveBits() {
        assertEquals(4.5, Precision.parse("4.5"));
        assertEquals(16, Precision.parse(" 16 "));
        assertEquals("4.5", Precision.label(4.5));
        assertEquals("16", Precision.label(16));
    }

    @Test
    void unknownOrOutOfRangeIsRefusedWithTheAcceptedNames() {
        TareException unknown = assertThrows(TareException.class, () -> Precision.parse("fp12x"));
        assertTrue(unknown.getMessage().contains("unknown precision 'fp12x'")
                && unknown.getMessage().contains("fp16") && unknown.getMessage().contains("4.5"), unknown.getMessage());
        assertThrows(TareException.class, () -> Precision.parse("0"));
        assertThrows(TareException.class, () -> Precision.parse("64"));
        assertThrows(TareException.class, () -> Precision.check(Double.NaN));
    }
    @Test
    void groupFormatsSayWhatTheirScalesAdd() {
        // a 16-bit scale per group of 32 weights adds 16 / 32 = 0.5 bit (from memory)
        assertEquals(4.5, Precision.parse("int4-g32"));
        assertEquals(4.125, Precision.parse("int4-g128"));
        assertEquals(3.5, Precision.parse("int3-g32"));
        assertTrue(Precision.meaning("int4-g32").contains("16-bit scale per group of 32"), Precision.meaning("int4-g32"));
        assertTrue(Precision.meaning("int4-g32").contains("from memory"));
        assertTrue(Precision.meaning(4.5).isPresent());
        assertTrue(Precision.meaning(4).isEmpty());
        for (String name : Precision.names().keySet()) {
            assertFalse(Precision.meaning(name).isBlank(), name);
        }
    }
}
