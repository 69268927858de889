namespace Lookup.Sweeps;

/// <summary>Pixel size of a photo as the aligner needs it.</summary>
internal readonly record struct PhotoShape(int Width, int Height)
{
    public double Area => (double)Width * Height;

    public double Aspect => (double)Width / Height;

    public static PhotoShape Of(SweepPhoto photo) => new(Math.Max(photo.Width, 1), Math.Max(photo.Height, 1));
}
