namespace LongRecord.Formats.Ishne;

/// <summary>Lead specification codes of ISHNE 1.0 (Badilini 1998, Table 1). Files may hold codes outside the table.</summary>
public enum IshneLeadCode : short
{
    Unknown = 0,
    GenericBipolar = 1,
    XBipolar = 2,
    YBipolar = 3,
    ZBipolar = 4,
    I = 5,
    II = 6,
    III = 7,
    AVR = 8,
    AVL = 9,
    AVF = 10,
    V1 = 11,
    V2 = 12,
    V3 = 13,
    V4 = 14,
    V5 = 15,
    V6 = 16,
    ES = 17,
    AS = 18,
    AI = 19,
}
