namespace Lookup.Store;

/// <summary>One thing <see cref="IndexChecker"/> found wrong with an index.</summary>
/// <param name="Code">Stable short name (e.g. <c>orphan-node</c>), for scripts and the documentation.</param>
/// <param name="Severity">Error or warning.</param>
/// <param name="Count">How many nodes, records or documents are affected.</param>
/// <param name="Message">What is wrong, with the numbers and the first examples.</param>
/// <param name="Fix">What to do about it.</param>
/// <param name="Repairable">True when <see cref="IndexChecker.Repair(IndexFile, bool)"/> fixes it without embedding anything.</param>
public sealed record CheckFinding(string Code, CheckSeverity Severity, int Count, string Message, string Fix, bool Repairable);
