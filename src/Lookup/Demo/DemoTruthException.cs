namespace Lookup.Demo;

/// <summary>The demo folder's <c>truth.json</c> is missing or cannot be read; the message names the file and the fix.</summary>
internal sealed class DemoTruthException(string message, Exception? inner = null) : Exception(message, inner);
