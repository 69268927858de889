namespace Lookup.Sweeps;

/// <summary>A photo listed in a finding.</summary>
public sealed record FindingMember(
    int PhotoId,
    string Sku,
    string Path,
    string Sha256,
    int Width,
    int Height,
    long FileSize,
    MemberRole Role = MemberRole.Member)
{
    public static FindingMember Of(SweepPhoto photo, MemberRole role = MemberRole.Member) => new(
        photo.Id, photo.Sku, photo.Path, photo.Sha256.ToLowerInvariant(), photo.Width, photo.Height, photo.FileSize, role);
}
