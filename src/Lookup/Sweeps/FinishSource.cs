namespace Lookup.Sweeps;

/// <summary>The finish of the part in a photo (e.g. by decoding its file); null when it cannot be measured.</summary>
public delegate FinishSignature? FinishSource(SweepPhoto photo);
