namespace Lookup.Tests.Imaging;

/// <summary>
/// One file of the hostile corpus: its name (the extension matters to the scanner), its bytes, and what must
/// become of it.
/// </summary>
/// <param name="Name">File name, e.g. "cut-50pct.jpg".</param>
/// <param name="Content">The bytes, generated from code.</param>
/// <param name="Reason">The rejection reason it must be recorded with (a <c>PhotoRejectionReason</c> name), or null when it is a usable photo that must be indexed.</param>
/// <param name="What">What the case is, for failure messages and the developer guide.</param>
internal sealed record HostilePhoto(string Name, byte[] Content, string? Reason, string What)
{
    public override string ToString() => $"{Name} ({What}, {Content.Length:N0} bytes, expect {Reason ?? "indexed"})";
}
