namespace Lightfold;

/// <summary>Bad input from the user (a config value, a table row, a file): reported as one message, exit code 2.</summary>
/// <remarks>Anything else that escapes is a bug and is reported with a stack trace (exit code 1).</remarks>
public class InputException(string message, Exception? inner = null) : Exception(message, inner)
{
    /// <summary>A user-supplied value made safe for a one-line message: control characters become spaces, long values are cut.</summary>
    public static string Shown(string? value, int max = 60)
    {
        if (value is null) return "(missing)";
        var chars = value.Select(c => char.IsControl(c) ? ' ' : c).ToArray();
        string s = new(chars);
        return s.Length > max ? s[..max] + "…" : s;
    }
}
