package org.fabspread.study;

/** What a layer does in the device; used for the loss split and for the collection geometry. */
public enum LayerRole {
    SUBSTRATE, ELECTRODE, ELECTRON_TRANSPORT, HOLE_TRANSPORT, ABSORBER, OTHER
}
