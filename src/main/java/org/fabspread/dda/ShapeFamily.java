package org.fabspread.dda;

import java.util.List;

import org.fabspread.shapes.Shape;

/** Shapes of one kind whose uncertain parameters vary: the rest is fixed. */
public interface ShapeFamily {

    /** Names of the varying parameters, in the order of {@link #shape}'s argument. */
    List<String> varying();

    /** The shape at these values of the varying parameters (nm). */
    Shape shape(double[] values);

    /** A canonical text of the kind and the fixed parameters (enters the cache key). */
    String describe();
}
