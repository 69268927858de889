using Lookup.Calibration;
using Lookup.Store;

namespace Lookup.Tests.Calibration;

/// <summary>Variants of a real calibration input: photos remapped or dropped, another root or model.</summary>
internal static class CalibrationInputs
{
    public static CalibrationInput With(CalibrationInput input, Func<PhotoRecord, PhotoRecord> map, int? take = null, string? root = null, string? fingerprint = null)
    {
        int count = Math.Min(take ?? input.Photos.Count, input.Photos.Count);
        var photos = input.Photos.Take(count).Select(map).ToList();
        var vectors = input.Vectors.AsSpan(0, count * input.Dimension).ToArray();
        return new CalibrationInput(input.IndexPath, root ?? input.CatalogueRoot, fingerprint ?? input.ModelFingerprint, photos, vectors, input.Dimension, count, input.Current);
    }
}
