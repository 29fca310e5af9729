package org.solmass;

import org.junit.jupiter.api.Test;
import org.solmass.cli.Main;

import static org.junit.jupiter.api.Assertions.assertEquals;

class CliSmokeTest {
    @Test
    void helpExitsZeroAndUnknownFlagIsBadUsage() {
        assertEquals(Main.EXIT_OK, Main.execute("--help"));
        assertEquals(Main.EXIT_INPUT, Main.execute("--no-such-flag"));
    }
}
