namespace Lookup.Store;

/// <summary>Whether a catalogue photo made it into the graph.</summary>
public enum PhotoStatus
{
    /// <summary>Embedded; <see cref="PhotoRecord.NodeId"/> names its graph node.</summary>
    Indexed,

    /// <summary>Could not be used; <see cref="PhotoRecord.FailureReason"/> says why. Retried when the file changes.</summary>
    Failed,
}
