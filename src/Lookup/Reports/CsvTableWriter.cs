using System.Globalization;

namespace Lookup.Reports;

/// <summary>
/// Writes a CSV table one cell at a time: text cells neutralised and quoted (<see cref="CsvCell.Text"/>), numbers
/// in the invariant culture, fields separated by commas and records ended by CRLF (RFC 4180, section 2).
/// Not thread-safe; the caller owns the <see cref="TextWriter"/>.
/// </summary>
internal sealed class CsvTableWriter
{
    private readonly TextWriter _writer;
    private bool _rowStarted;

    /// <summary>A writer appending to <paramref name="writer"/>.</summary>
    public CsvTableWriter(TextWriter writer)
    {
        ArgumentNullException.ThrowIfNull(writer);
        _writer = writer;
    }

    /// <summary>Writes a whole row of text cells and ends it.</summary>
    public void Row(params IEnumerable<string?> cells)
    {
        foreach (var cell in cells)
        {
            Text(cell);
        }

        EndRow();
    }

    /// <summary>Appends a text cell (null is written as an empty cell).</summary>
    public CsvTableWriter Text(string? value) => Raw(CsvCell.Text(value));

    /// <summary>Appends an integer cell.</summary>
    public CsvTableWriter Number(long value) => Raw(value.ToString(CultureInfo.InvariantCulture));

    /// <summary>Appends a number cell in the given .NET format, invariant culture ("R" round-trips).</summary>
    public CsvTableWriter Number(double value, string format = "R") =>
        Raw(double.IsFinite(value) ? value.ToString(format, CultureInfo.InvariantCulture) : "");

    /// <summary>Ends the current row with CRLF.</summary>
    public void EndRow()
    {
        _writer.Write("\r\n");
        _rowStarted = false;
    }

    private CsvTableWriter Raw(string cell)
    {
        if (_rowStarted)
        {
            _writer.Write(',');
        }

        _writer.Write(cell);
        _rowStarted = true;
        return this;
    }
}
