namespace Lookup.Sweeps;

/// <summary>
/// The thumbnail of each photo: the stored one, else one made on demand by the <see cref="ThumbnailSource"/> at most
/// about once per photo (two threads may race to make the same one; both results are equal and one is kept).
/// </summary>
internal sealed class ThumbnailCache(IReadOnlyList<SweepPhoto> photos, ThumbnailSource? source)
{
    private readonly GreyThumbnail?[] _made = new GreyThumbnail?[photos.Count];
    private readonly bool[] _tried = new bool[photos.Count];

    public GreyThumbnail? Get(int index)
    {
        var photo = photos[index];
        if (photo.Thumbnail is not null || source is null)
        {
            return photo.Thumbnail;
        }

        if (Volatile.Read(ref _tried[index]))
        {
            return Volatile.Read(ref _made[index]);
        }

        var made = source(photo);
        Volatile.Write(ref _made[index], made);
        Volatile.Write(ref _tried[index], true);
        return made;
    }
}
