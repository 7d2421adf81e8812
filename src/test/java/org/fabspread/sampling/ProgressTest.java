package org.fabspread.sampling;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;

import org.junit.jupiter.api.Test;

class ProgressTest {

    @Test
    void lineShowsSamplesRateAndTimeLeft() {
        assertEquals("1:02:05", Progress.clock(3725));
        assertEquals("2:05", Progress.clock(125));
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        Progress p = new Progress(new PrintStream(bytes, true, StandardCharsets.UTF_8), 1000);
        p.chunkDone(1, 0);
        // 500 of 1000 samples in 10 s: 50 per second, 10 s left
        String line = p.line(500, 10);
        assertTrue(line.startsWith("500/1000 samples (50.0%)  50/s  0:10 left"), line);
        p.chunkDone(10, 1000);
        p.finish();
        String text = bytes.toString(StandardCharsets.UTF_8);
        assertTrue(text.startsWith("\r") && text.contains("1000/1000 samples") && text.endsWith(System.lineSeparator()), text);
    }
}
