namespace Lookup.Matching;

/// <summary>One query photo ready to match.</summary>
/// <param name="Label">How the photo is named in answers: the path given, or the catalogue path for a stored photo.</param>
/// <param name="Crops">Unit embeddings, the whole photo first and then each crop of the <see cref="CropSet"/>.</param>
/// <param name="Sha256">Lower-case hex SHA-256 of the file's bytes, to find identical catalogue files; null when unknown.</param>
/// <param name="DifferenceHash">dHash of the whole photo, evidence for "same photo"; null when unknown.</param>
internal sealed record QueryPhoto(string Label, float[][] Crops, string? Sha256, ulong? DifferenceHash);
