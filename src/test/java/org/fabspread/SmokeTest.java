package org.fabspread;
import org.junit.jupiter.api.Test;
class SmokeTest { @Test void runs() { org.junit.jupiter.api.Assertions.assertTrue(true); } }
