-- Accounts that exist when address verification lands count as verified; an account a team import made,
-- never claimed, has proved nothing and stays unverified (claiming it now goes through a mailed link).
UPDATE `users` SET `email_verified_at` = (unixepoch('subsec') * 1000) WHERE `email_verified_at` IS NULL AND `password_hash` <> 'imported-account:no-password';
