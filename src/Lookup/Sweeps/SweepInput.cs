namespace Lookup.Sweeps;

/// <summary>Checks the sweep's input once, at the entry point, with messages that name the photo and the fix.</summary>
internal static class SweepInput
{
    /// <summary>Returns the index of each photo id.</summary>
    public static Dictionary<int, int> Check(IReadOnlyList<SweepPhoto> photos)
    {
        var indexOfId = new Dictionary<int, int>(photos.Count);
        var dimension = photos.Count == 0 ? 0 : photos[0].Embedding.Length;
        for (var i = 0; i < photos.Count; i++)
        {
            var photo = photos[i] ?? throw new ArgumentException($"Photo {i} of the sweep is null.", nameof(photos));
            if (!indexOfId.TryAdd(photo.Id, i))
            {
                throw new ArgumentException(
                    $"Photo id {photo.Id} is used by both {photos[indexOfId[photo.Id]].Path} and {photo.Path}: ids must be unique.",
                    nameof(photos));
            }

            if (photo.Embedding.Length == 0 || photo.Embedding.Length != dimension)
            {
                throw new ArgumentException(
                    $"Photo {photo.Path} has an embedding of {photo.Embedding.Length} floats where {dimension} were expected: " +
                    "every photo of one sweep needs an embedding from the same model (re-ingest the photo).",
                    nameof(photos));
            }

            // Cosine distance is 1 − dot only for unit vectors; a raw embedding would make every distance wrong.
            var norm = System.Numerics.Tensors.TensorPrimitives.Norm(photo.Embedding.Span);
            if (Math.Abs(norm - 1f) > 1e-3f)
            {
                throw new ArgumentException(
                    $"Photo {photo.Path} has an embedding of length {norm:0.######}, not 1: the sweep needs L2-normalised " +
                    "embeddings (normalise them when reading the index, or re-ingest the photo).",
                    nameof(photos));
            }

            if (string.IsNullOrEmpty(photo.Sku) || string.IsNullOrEmpty(photo.Sha256))
            {
                throw new ArgumentException(
                    $"Photo {photo.Path} has no {(string.IsNullOrEmpty(photo.Sku) ? "SKU" : "SHA-256")}: re-ingest it.",
                    nameof(photos));
            }
        }

        return indexOfId;
    }
}
