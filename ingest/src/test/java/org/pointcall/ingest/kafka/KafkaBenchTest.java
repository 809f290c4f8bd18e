package org.pointcall.ingest.kafka;

import org.junit.jupiter.api.Test;
import org.pointcall.shared.error.PointcallException;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;

/** The measurement itself needs Maven and two child JVMs: it is run by hand (see the package documentation). */
class KafkaBenchTest {
    @Test
    void optionsParseAndBadOnesAreNamed() {
        KafkaBench.Options o = KafkaBench.parse(new String[] {"--records", "200_000", "--record-size", "512",
            "--bootstrap", "127.0.0.1:9092", "--rounds", "3"});
        assertEquals(200_000, o.records());
        assertEquals(512, o.recordBytes());
        assertEquals("127.0.0.1:9092", o.bootstrap());
        assertEquals(3, o.rounds());
        assertEquals(KafkaBench.Options.defaults().lingerMs(), o.lingerMs());
        assertNull(KafkaBench.Options.defaults().bootstrap());
        assertEquals("unknown option --recods", assertThrows(PointcallException.class,
                () -> KafkaBench.parse(new String[] {"--recods", "5"})).getMessage());
        assertEquals("option --records needs a whole number, got 'many'", assertThrows(PointcallException.class,
                () -> KafkaBench.parse(new String[] {"--records", "many"})).getMessage());
        assertEquals("option --rounds needs a value", assertThrows(PointcallException.class,
                () -> KafkaBench.parse(new String[] {"--rounds"})).getMessage());
    }
}
