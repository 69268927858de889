namespace Lookup.Store;

/// <summary>How much a check finding matters.</summary>
public enum CheckSeverity
{
    /// <summary>The index gives wrong or incomplete answers, or a command refuses it: <c>lookup check</c> exits 1.</summary>
    Error,

    /// <summary>Worth knowing and acting on, but answers are still right (exit code unaffected).</summary>
    Warning,
}
