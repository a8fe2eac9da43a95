namespace Lightfold;

/// <summary>Bad input from the user (a config value, a table row, a file): reported as one message, exit code 2.</summary>
/// <remarks>Anything else that escapes is a bug and is reported with a stack trace (exit code 1).</remarks>
public class InputException(string message, Exception? inner = null) : Exception(message, inner);
